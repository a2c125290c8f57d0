// Deterministic assignment of a batch's files to N parts, balanced by file size.
//
// Greedy "longest processing time first" (Graham 1969): take the files from largest to smallest and give each to the
// part with the least bytes so far. Its largest part is at most 4/3 − 1/(3N) times the best possible. Ties are broken
// by position in the sorted file list and by part number, so the same list and sizes give the same parts everywhere.

/** One file of the whole, sorted input list: its relative path and size in bytes. */
export interface SizedFile {
  readonly file: string;
  readonly bytes: number;
}

/** Part (0-based) of every file, in the order of `bytes` (the sorted input list's sizes). */
export function assignParts(bytes: readonly number[], parts: number): Int32Array {
  if (!Number.isInteger(parts) || parts < 1) throw new Error(`assignParts: parts must be a whole number ≥ 1 (got ${parts})`);
  const order = bytes.map((_, i) => i).sort((a, b) => bytes[b] - bytes[a] || a - b);
  const load = new Float64Array(parts);
  const part = new Int32Array(bytes.length);
  // A binary heap keyed on (load, part number) keeps each pick O(log N) for thousands of files and parts.
  const heap = Array.from({ length: parts }, (_, i) => i);
  const less = (a: number, b: number): boolean => load[a] < load[b] || (load[a] === load[b] && a < b);
  const siftDown = (): void => {
    let i = 0;
    for (;;) {
      const l = 2 * i + 1;
      const r = l + 1;
      let m = i;
      if (l < parts && less(heap[l], heap[m])) m = l;
      if (r < parts && less(heap[r], heap[m])) m = r;
      if (m === i) return;
      [heap[i], heap[m]] = [heap[m], heap[i]];
      i = m;
    }
  };
  for (const i of order) {
    const p = heap[0];
    part[i] = p;
    load[p] += Math.max(0, bytes[i]);
    siftDown();
  }
  return part;
}

/** Indices (into the sorted list) of the files of part `part` (1-based) of `parts`, in list order. */
export function filesOfPart(bytes: readonly number[], part: number, parts: number): number[] {
  const assigned = assignParts(bytes, parts);
  const out: number[] = [];
  for (let i = 0; i < assigned.length; i += 1) if (assigned[i] === part - 1) out.push(i);
  return out;
}

/** The text whose SHA-256 identifies a whole input list: one "bytes<TAB>path" line per file, in list order. */
export function inputListText(files: readonly SizedFile[]): string {
  return files.map((f) => `${f.bytes}\t${f.file}\n`).join('');
}
