// Reading a movie's next time point while the current one is analysed.
import type { PixelArray, PlaneSource, RawPlane, StackInfo } from '../model';
import { reusedPlaneArrays } from '../image';

/** Most bytes of prefetched planes held (two time points' planes); a movie with larger time points is not prefetched. */
export const PREFETCH_MAX_BYTES = 64 * 2 ** 20;

/** Bytes per sample of each sample type. */
const SAMPLE_BYTES: Record<StackInfo['sampleType'], number> = { uint8: 1, int8: 1, uint16: 2, int16: 2, uint32: 4, int32: 4, float32: 4, float64: 8 };

/** A PlaneSource that reads ahead, and settle() to wait for the reads it started itself. */
export interface PrefetchingSource extends PlaneSource {
  /** Resolves once every read started ahead has finished (succeeded or not); the wrapped source is not closed. */
  settle(): Promise<void>;
}

/**
 * A PlaneSource over `source` for reading the time points `times` in that order: when plane (z, c, t) is asked for,
 * the same plane of the next time point in `times` is read at once, so its decoding (the file read, inflating on
 * node:zlib's thread pool) runs while time point t is analysed. Each plane is decoded into an array of this source's
 * own, one per plane and per parity of the time point's position in `times` (`into` is not used): a plane stays valid
 * until the same plane of the time point after next is read. A failed read is reported when its plane is asked for,
 * with the wrapped source's message. The same planes, bit for bit, as `source` gives; close() closes `source`.
 * Returns `source` itself (no reading ahead) when two time points' planes would exceed PREFETCH_MAX_BYTES.
 */
export function prefetchingSource(source: PlaneSource, info: StackInfo, times: readonly number[]): PrefetchingSource {
  const planeValues = info.sizeX * info.sizeY;
  const perTime = info.sizeZ * info.sizeC;
  if (2 * perTime * planeValues * SAMPLE_BYTES[info.sampleType] > PREFETCH_MAX_BYTES) {
    return { readPlane: (z, c, t, into) => source.readPlane(z, c, t, into), close: () => source.close(), settle: () => Promise.resolve() };
  }
  const position = new Map<number, number>();
  times.forEach((t, k) => { if (!position.has(t)) position.set(t, k); });
  const arrays = reusedPlaneArrays();
  const started = new Map<string, Promise<RawPlane>>();
  // The last read into each array: a read waits for it, so two reads never write one array at once.
  const lastInto = new Map<number, Promise<unknown>>();
  const slotOf = (z: number, c: number, t: number): number => ((position.get(t) ?? 0) % 2) * perTime + z * info.sizeC + c;
  const read = (z: number, c: number, t: number): Promise<RawPlane> => {
    const slot = slotOf(z, c, t);
    const before = lastInto.get(slot) ?? Promise.resolve();
    const into: PixelArray = arrays.at(slot, info.sampleType, planeValues);
    const plane = before.then(() => source.readPlane(z, c, t, into));
    const done = plane.catch(() => undefined);
    lastInto.set(slot, done);
    return plane;
  };
  return {
    async readPlane(z, c, t) {
      const key = `${z},${c},${t}`;
      const plane = started.get(key) ?? read(z, c, t);
      started.delete(key);
      const k = position.get(t);
      const next = k !== undefined && k + 1 < times.length ? times[k + 1] : null;
      const nextKey = `${z},${c},${next}`;
      if (next !== null && next !== t && !started.has(nextKey)) {
        const ahead = read(z, c, next);
        // Reported when its plane is asked for; never an unhandled rejection meanwhile.
        ahead.catch(() => undefined);
        started.set(nextKey, ahead);
      }
      return plane;
    },
    close: () => source.close(),
    async settle() {
      await Promise.all([...lastInto.values()]);
    },
  };
}
