import { describe, expect, it } from 'vitest';
import { keyCommand } from './useKeys';

// The shortcut table (our own choice) pinned.
const k = (key: string, mods: Partial<{ ctrlKey: boolean; metaKey: boolean; shiftKey: boolean; altKey: boolean }> = {}) =>
  keyCommand({ key, ctrlKey: false, metaKey: false, shiftKey: false, altKey: false, ...mods });

describe('keyCommand', () => {
  it('maps undo and redo', () => {
    expect(k('z', { ctrlKey: true })).toBe('undo');
    expect(k('Z', { ctrlKey: true, shiftKey: true })).toBe('redo');
    expect(k('y', { metaKey: true })).toBe('redo');
  });
  it('maps editing and view keys', () => {
    expect(k('s')).toBe('swap');
    expect(k('Delete')).toBe('delete');
    expect(k('+')).toBe('zoom-in');
    expect(k('-')).toBe('zoom-out');
    expect(k('f')).toBe('fit');
    expect(k('PageDown')).toBe('next-file');
    expect(k('l')).toBe('tool-landmark');
    expect(k('F1')).toBe('help');
  });
  it('ignores other keys and Ctrl with plain letters', () => {
    expect(k('q')).toBeNull();
    expect(k('s', { altKey: true })).toBeNull();
  });
});
