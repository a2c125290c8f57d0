// "K/N": which part of a split batch to analyse, and the folder each part writes to.
import { BatchOptionError } from '../batch';

/** Most parts a batch may be split into (Slurm's default MaxArraySize is 1001, from memory; 10000 leaves room). */
export const MAX_PARTS = 10_000;

/** Part K (1-based) of N parts. */
export interface ShardSpec {
  readonly part: number;
  readonly parts: number;
}

const WHOLE = /^\s*(\d+)\s*\/\s*(\d+)\s*$/;

/** Parse "K/N" with 1 ≤ K ≤ N ≤ MAX_PARTS; throws BatchOptionError with a one-line message otherwise. */
export function parseShardSpec(text: string): ShardSpec {
  const m = WHOLE.exec(text);
  if (!m) throw new BatchOptionError(`--shard must look like K/N, e.g. 2/8 for the second of eight parts (got "${text}")`);
  const part = Number(m[1]);
  const parts = Number(m[2]);
  if (parts < 1 || parts > MAX_PARTS) throw new BatchOptionError(`--shard: the number of parts must be from 1 to ${MAX_PARTS} (got ${parts})`);
  if (part < 1 || part > parts) throw new BatchOptionError(`--shard: the part must be from 1 to ${parts} (got ${part})`);
  return { part, parts };
}

/** Name of the folder a part writes to under `<out>/parts/`: "K-of-N". */
export function partFolderName(spec: ShardSpec): string {
  return `${spec.part}-of-${spec.parts}`;
}

/** Read a part folder name back ("K-of-N"); null when the name has another form. */
export function parsePartFolderName(name: string): ShardSpec | null {
  const m = /^(\d+)-of-(\d+)$/.exec(name);
  if (!m) return null;
  const part = Number(m[1]);
  const parts = Number(m[2]);
  return part >= 1 && part <= parts ? { part, parts } : null;
}
