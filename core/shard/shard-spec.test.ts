import { describe, expect, it } from 'vitest';
import { parsePartFolderName, parseShardSpec, partFolderName } from './shard-spec';

describe('parseShardSpec', () => {
  it('reads K/N', () => {
    expect(parseShardSpec('2/8')).toEqual({ part: 2, parts: 8 });
    expect(parseShardSpec(' 1 / 1 ')).toEqual({ part: 1, parts: 1 });
  });

  it('refuses other forms with one line', () => {
    expect(() => parseShardSpec('2-8')).toThrow('--shard must look like K/N, e.g. 2/8 for the second of eight parts (got "2-8")');
    expect(() => parseShardSpec('0/4')).toThrow('--shard: the part must be from 1 to 4 (got 0)');
    expect(() => parseShardSpec('5/4')).toThrow('--shard: the part must be from 1 to 4 (got 5)');
    expect(() => parseShardSpec('1/0')).toThrow('--shard: the number of parts must be from 1 to 10000 (got 0)');
    expect(() => parseShardSpec('1.5/4')).toThrow('--shard must look like K/N');
  });
});

describe('part folder names', () => {
  it('are K-of-N and read back', () => {
    expect(partFolderName({ part: 3, parts: 12 })).toBe('3-of-12');
    expect(parsePartFolderName('3-of-12')).toEqual({ part: 3, parts: 12 });
    expect(parsePartFolderName('13-of-12')).toBeNull();
    expect(parsePartFolderName('3-of-12 copy')).toBeNull();
  });
});
