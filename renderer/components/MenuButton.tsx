// A button that opens a small menu: Escape or a click elsewhere closes it, arrow keys move between its items,
// and focus goes back to the button when it closes.
import { useEffect, useRef } from 'react';
import type { ReactNode } from 'react';

/** One menu entry. */
export interface MenuItem {
  readonly id: string;
  readonly label: string;
  readonly onSelect: () => void;
  readonly disabled?: boolean;
  readonly title?: string;
  readonly testId?: string;
  /** Shown checked (a toggle such as a tool). */
  readonly checked?: boolean;
}

/** Props of a menu button. */
export interface MenuButtonProps {
  readonly label: ReactNode;
  readonly items: readonly MenuItem[];
  readonly open: boolean;
  readonly onOpen: (open: boolean) => void;
  readonly disabled?: boolean;
  readonly title?: string;
  readonly testId?: string;
  /** Open the list towards the left (for a button at the right end of the toolbar). */
  readonly alignRight?: boolean;
}

/** Focus the next or previous enabled item of the list. */
function moveFocus(list: HTMLElement, step: 1 | -1): void {
  const items = [...list.querySelectorAll<HTMLButtonElement>('button:not(:disabled)')];
  if (items.length === 0) return;
  const i = items.indexOf(document.activeElement as HTMLButtonElement);
  items[(i + step + items.length) % items.length].focus();
}

/** The menu button. */
export function MenuButton(p: MenuButtonProps) {
  const root = useRef<HTMLDivElement>(null);
  const button = useRef<HTMLButtonElement>(null);
  const list = useRef<HTMLUListElement>(null);
  const close = (refocus: boolean) => { p.onOpen(false); if (refocus) button.current?.focus(); };
  useEffect(() => {
    if (!p.open) return;
    list.current?.querySelector<HTMLButtonElement>('button:not(:disabled)')?.focus();
    const outside = (e: PointerEvent) => { if (root.current !== null && !root.current.contains(e.target as Node)) p.onOpen(false); };
    document.addEventListener('pointerdown', outside);
    return () => document.removeEventListener('pointerdown', outside);
  }, [p.open]);
  return (
    <div className="menu" ref={root}>
      <button ref={button} disabled={p.disabled} title={p.title} data-testid={p.testId} aria-haspopup="menu" aria-expanded={p.open}
        onClick={() => p.onOpen(!p.open)}
        onKeyDown={(e) => { if (e.key === 'ArrowDown' && !p.open) { e.preventDefault(); p.onOpen(true); } }}>{p.label}</button>
      {p.open && (
        <ul className={`menu-list${p.alignRight ? ' align-right' : ''}`} role="menu" ref={list}
          onKeyDown={(e) => {
            if (e.key === 'Escape') { e.preventDefault(); e.stopPropagation(); close(true); }
            else if (e.key === 'ArrowDown' || e.key === 'ArrowUp') { e.preventDefault(); if (list.current) moveFocus(list.current, e.key === 'ArrowDown' ? 1 : -1); }
            else if (e.key === 'Tab') close(false);
          }}>
          {p.items.map((it) => (
            <li key={it.id} role="none">
              <button role={it.checked === undefined ? 'menuitem' : 'menuitemcheckbox'} aria-checked={it.checked} disabled={it.disabled}
                title={it.title} data-testid={it.testId} className={it.checked ? 'on' : ''}
                onClick={() => { close(true); it.onSelect(); }}>{it.checked !== undefined && <span className="check">{it.checked ? '✓' : ''}</span>}{it.label}</button>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
