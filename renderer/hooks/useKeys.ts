// Keyboard shortcuts of the editor window.

/** What a key press asks for, or null. Pure so it can be tested without a DOM. */
export type KeyCommand =
  | 'undo' | 'redo' | 'save' | 'swap' | 'fit' | 'zoom-in' | 'zoom-out' | 'delete' | 'next-file' | 'prev-file'
  | 'tool-pan' | 'tool-axis' | 'tool-landmark' | 'help';

/** Map a key event (key + modifiers) to a command. */
export function keyCommand(e: { key: string; ctrlKey: boolean; metaKey: boolean; shiftKey: boolean; altKey: boolean }): KeyCommand | null {
  const mod = e.ctrlKey || e.metaKey;
  const k = e.key.toLowerCase();
  if (mod && k === 'z') return e.shiftKey ? 'redo' : 'undo';
  if (mod && k === 'y') return 'redo';
  if (mod && k === 's') return 'save';
  if (e.key === 'F1') return 'help';
  if (mod || e.altKey) return null;
  switch (e.key) {
    case 's': case 'S': return 'swap';
    case 'f': case 'F': case '0': return 'fit';
    case '+': case '=': return 'zoom-in';
    case '-': case '_': return 'zoom-out';
    case 'Delete': case 'Backspace': return 'delete';
    case 'PageDown': case ']': return 'next-file';
    case 'PageUp': case '[': return 'prev-file';
    case 'h': case 'H': return 'tool-pan';
    case 'a': case 'A': return 'tool-axis';
    case 'l': case 'L': return 'tool-landmark';
    case '?': return 'help';
    default: return null;
  }
}
