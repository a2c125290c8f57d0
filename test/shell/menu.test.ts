import { describe, it, expect } from 'vitest';
import { buildMenuTemplate, type MenuItemSpec } from '../../app/main/menu';
import { MENU_COMMANDS } from '../../core/contract';

/** Every clickable item, with its top-level menu. */
function flatten(items: readonly MenuItemSpec[], top = ''): { top: string; item: MenuItemSpec }[] {
  return items.flatMap((i) => [{ top, item: i }, ...flatten(i.submenu ?? [], top || (i.label ?? ''))]);
}

describe('application menu', () => {
  it('has File, Edit, View and Help with the agreed shortcuts', () => {
    const sent: string[] = [];
    const template = buildMenuTemplate((c) => sent.push(c), [], false);
    expect(template.map((m) => m.label)).toEqual(['File', 'Edit', 'View', 'Help']);
    const byLabel = new Map(flatten(template).map(({ item }) => [item.label, item]));
    // Source: Eggline shell specification, menu section (Open Folder Ctrl+O, Save Ctrl+S, Undo Ctrl+Z, Redo Ctrl+Shift+Z).
    expect(byLabel.get('Open Folder…')?.accelerator).toBe('CmdOrCtrl+O');
    expect(byLabel.get('Save')?.accelerator).toBe('CmdOrCtrl+S');
    expect(byLabel.get('Undo')?.accelerator).toBe('CmdOrCtrl+Z');
    expect(byLabel.get('Redo')?.accelerator).toBe('CmdOrCtrl+Shift+Z');
    for (const label of ['Open Files…', 'Open Project…', 'Open Demo Data', 'Export…', 'Fit to Window', 'Zoom In', 'Zoom Out', 'Swap Anterior/Posterior']) {
      byLabel.get(label)?.click?.();
    }
    expect(sent).toEqual(['open-files', 'open-project', 'open-demo', 'export', 'fit-to-window', 'zoom-in', 'zoom-out', 'swap-poles']);
    for (const c of sent) expect(MENU_COMMANDS).toContain(c);
  });

  it('lists recent paths newest first and sends open-recent with the path', () => {
    const sent: string[] = [];
    const template = buildMenuTemplate((c) => sent.push(c), ['/data/run2', '/data/run1/e1.tif'], false);
    const recent = flatten(template).find(({ item }) => item.label === 'Recent')!.item.submenu!;
    expect(recent.map((i) => i.label)).toEqual(['run2 — /data/run2', 'e1.tif — /data/run1/e1.tif']);
    recent[1].click!();
    expect(sent).toEqual(['open-recent:/data/run1/e1.tif']);
    const empty = flatten(buildMenuTemplate(() => undefined, [], false)).find(({ item }) => item.label === 'Recent')!.item.submenu!;
    expect(empty).toEqual([{ label: 'No recent items', enabled: false }]);
  });

  it('shows the About box from the main process', () => {
    let shown = 0;
    const help = buildMenuTemplate(() => undefined, [], false, () => { shown++; }).find((m) => m.label === 'Help')!;
    help.submenu!.find((i) => i.label === 'About Eggline')!.click!();
    expect(shown).toBe(1);
  });

  it('adds the application menu on macOS', () => {
    expect(buildMenuTemplate(() => undefined, [], true).map((m) => m.label)).toEqual(['Eggline', 'File', 'Edit', 'View', 'Help']);
  });
});
