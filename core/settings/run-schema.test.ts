import { describe, expect, it } from 'vitest';
import { flagValue } from './check';
import { bytesFromText, RUN_SETTINGS, runSettingSpec, SETTINGS } from './schema';

// Source for the messages: this project's pinned wording (the same rule text as the analysis settings' flags).
describe('the run settings (RUN_SETTINGS)', () => {
  it('are rows like the analysis settings, with their own flags', () => {
    for (const spec of RUN_SETTINGS) {
      expect(spec.flag).toMatch(/^--[a-z][a-z-]*$/);
      expect([spec.label, spec.help, spec.rule].every((t) => t.length > 0)).toBe(true);
    }
    const flags = [...SETTINGS, ...RUN_SETTINGS].filter((s) => s.key !== 'sliceIndex').map((s) => s.flag);
    expect(new Set(flags).size).toBe(flags.length);
    expect(runSettingSpec('maxMemoryBytes').kind).toBe('size');
    expect(() => runSettingSpec('nope')).toThrow('no run setting "nope"');
  });

  it('read --max-memory sizes in powers of 1024, at least 64M', () => {
    // Source: IEC 80000-13 binary prefixes, from memory (Ki = 1024, Mi = 1024², Gi = 1024³), the units the flag takes.
    const spec = runSettingSpec('maxMemoryBytes');
    expect(bytesFromText('512M')).toBe(512 * 2 ** 20);
    expect(bytesFromText('1.5GiB')).toBe(1.5 * 2 ** 30);
    expect(bytesFromText('4 gb')).toBe(4 * 2 ** 30);
    expect(bytesFromText('2000000000')).toBe(2e9);
    expect(bytesFromText('lots')).toBeUndefined();
    expect(flagValue(spec, '64M')).toBe(2 ** 26);
    expect(() => flagValue(spec, '63M')).toThrow('--max-memory must be a size of at least 64M, like 512M, 4G or 1.5G (got "63M")');
    expect(() => flagValue(spec, '-3G')).toThrow('--max-memory must be a size of at least 64M, like 512M, 4G or 1.5G (got "-3G")');
  });

  it('check --jobs and --file-timeout as whole numbers in their ranges', () => {
    expect(flagValue(runSettingSpec('jobs'), '3')).toBe(3);
    expect(() => flagValue(runSettingSpec('jobs'), '0')).toThrow('--jobs must be a whole number from 1 to 256 (got "0")');
    expect(() => flagValue(runSettingSpec('jobs'), '2.5')).toThrow('--jobs must be a whole number from 1 to 256 (got "2.5")');
    expect(flagValue(runSettingSpec('fileTimeoutS'), '86400')).toBe(86_400);
    expect(() => flagValue(runSettingSpec('fileTimeoutS'), '86401')).toThrow('--file-timeout must be a whole number from 1 to 86400 (got "86401")');
  });
});
