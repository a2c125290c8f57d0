import { describe, expect, it } from 'vitest';
import { mergeCommand } from './merge-command';

// Source: this project's pinned wording for the merge command's options.
describe('mergeCommand options', () => {
  const io = { stdout: { write: () => true }, stderr: { write: () => true } };
  it('--background-condition, like --reference, needs --samples', async () => {
    await expect(mergeCommand(['out', '--background-condition', 'null-stain'], io as never)).rejects.toThrow('--background-condition needs --samples');
    await expect(mergeCommand(['out', '--reference', 'ref'], io as never)).rejects.toThrow('--reference needs --samples');
  });
});
