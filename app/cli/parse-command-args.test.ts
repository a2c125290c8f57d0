import { describe, expect, it } from 'vitest';
import { joinNegativeValues, parseCommandArgs } from './parse-command-args';

// Source: node:util parseArgs' documented forms ("--flag=value" passes a value that starts with a dash).
describe('joinNegativeValues', () => {
  const options = { depth: { type: 'string' }, quiet: { type: 'boolean' } } as const;
  it('joins a flag that takes a value with a negative number after it, and nothing else', () => {
    expect(joinNegativeValues(['--depth', '-3', 'in'], options)).toEqual(['--depth=-3', 'in']);
    expect(joinNegativeValues(['--depth', '-0.5'], options)).toEqual(['--depth=-0.5']);
    expect(joinNegativeValues(['--depth', '-.5'], options)).toEqual(['--depth=-.5']);
    expect(joinNegativeValues(['--depth', '-x'], options)).toEqual(['--depth', '-x']); // not a number: parseArgs decides
    expect(joinNegativeValues(['--quiet', '-3'], options)).toEqual(['--quiet', '-3']); // takes no value
    expect(joinNegativeValues(['--depth=4', '-3'], options)).toEqual(['--depth=4', '-3']);
    expect(joinNegativeValues(['--', '--depth', '-3'], options)).toEqual(['--', '--depth', '-3']);
  });
  it('lets parseCommandArgs hand the value to the flag', () => {
    expect(parseCommandArgs(['--depth', '-3'], options, 'x').values.depth).toBe('-3');
    expect(() => parseCommandArgs(['--depth', '-x'], options, 'x')).toThrow('option --depth needs a value; write --depth=VALUE for a value that starts with "-"');
    expect(() => parseCommandArgs(['--quiet=1'], options, 'x')).toThrow('option --quiet takes no value');
  });
});
