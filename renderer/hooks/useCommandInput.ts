// Where commands come from: keys pressed in the window (not while typing in a field) and the application menu. What
// each command does is the caller's `run`; the latest one is called, so it sees the latest state.
import { useEffect, useRef } from 'react';
import type { EgglineApi } from '../../core/contract';
import { keyCommand, type KeyCommand } from './useKeys';

/** Listen for keyboard and menu commands for the window's lifetime; Space held is reported apart (pan while held). */
export function useCommandInput(api: EgglineApi | null, run: (cmd: KeyCommand | string) => void, onSpaceHeld: (held: boolean) => void): void {
  const runRef = useRef(run);
  runRef.current = run;
  const spaceRef = useRef(onSpaceHeld);
  spaceRef.current = onSpaceHeld;
  useEffect(() => {
    const down = (e: KeyboardEvent) => {
      const t = e.target as HTMLElement | null;
      if (t !== null && ['INPUT', 'SELECT', 'TEXTAREA'].includes(t.tagName)) return;
      if (e.key === ' ') { spaceRef.current(true); e.preventDefault(); return; }
      const cmd = keyCommand(e);
      if (cmd === null) return;
      e.preventDefault();
      runRef.current(cmd);
    };
    const up = (e: KeyboardEvent) => { if (e.key === ' ') spaceRef.current(false); };
    window.addEventListener('keydown', down);
    window.addEventListener('keyup', up);
    return () => { window.removeEventListener('keydown', down); window.removeEventListener('keyup', up); };
  }, []);
  useEffect(() => api?.onMenuCommand((c) => runRef.current(c)), [api]);
}
