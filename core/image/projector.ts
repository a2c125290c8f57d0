// Streaming Z projection: planes are added one at a time so a whole stack is never held in memory.
import type { Plane, ProjectionMethod, RawPlane } from '../model';

/** Accumulates planes of one channel; result() returns the projection as a float plane (same units as the input). */
export interface Projector {
  /** Add one plane (any pixel type); its size must match the projector's. */
  add(plane: RawPlane | Plane): void;
  /** The projection so far, written into `out` when given (width × height values); throws when no plane was added. */
  result(out?: Float32Array): Plane;
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

/** Integer sample arrays (every value an integer that the projector's accumulators hold exactly). */
function isIntegerArray(d: ArrayLike<number>): d is Uint8Array | Uint16Array | Int8Array | Int16Array | Uint32Array | Int32Array {
  return d instanceof Uint8Array || d instanceof Uint16Array || d instanceof Int8Array || d instanceof Int16Array || d instanceof Uint32Array || d instanceof Int32Array;
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

/** out[i] = d[i] + 0: a sum that starts at +0 turns −0 into +0 and leaves every other value as it is. */
function plusZeroIntoFloat(d: ArrayLike<number>, out: Float32Array, n: number): void {
  for (let i = 0; i < n; i++) out[i] = d[i] + 0;
}

/** out[i] = d[i], NaN as −Infinity (a maximum that starts at −Infinity never takes a NaN). */
function maxOfOneIntoFloat(d: ArrayLike<number>, out: Float32Array, n: number): void {
  for (let i = 0; i < n; i++) { const v = d[i]; out[i] = v === v ? v : -Infinity; }
}

/**
 * The projection of a channel that has one plane, by `method`: bit for bit what createProjector gives after one add,
 * made in one conversion pass (no accumulator). Integer samples are converted as they are; float samples keep the
 * accumulator's two marks: a mean or sum starts at +0 (so −0 becomes +0), a maximum at −Infinity (so NaN becomes
 * −Infinity). Writes into `out` when given (width × height values), else into a new array.
 */
export function projectOnePlane(plane: RawPlane | Plane, method: ProjectionMethod, out?: Float32Array): Plane {
  checkProjectorOptions(plane.width, plane.height, method);
  const n = plane.width * plane.height;
  if (plane.data.length !== n) throw new Error(`plane is ${plane.width}×${plane.height} but holds ${plane.data.length} values`);
  if (out !== undefined && out.length !== n) throw new Error(`output holds ${out.length} values, the plane ${n}`);
  const data = out ?? new Float32Array(n);
  const d = plane.data as ArrayLike<number>;
  // TypedArray set converts as an assignment does (each value as Float32 rounds it), in native code, several times
  // faster than a loop (measured: 0.25 against 1.0 ns per pixel for 16-bit samples).
  if (!(d instanceof Float32Array || d instanceof Float64Array) || method === 'slice') data.set(plane.data);
  else if (method === 'max') maxOfOneIntoFloat(d, data, n);
  else plusZeroIntoFloat(d, data, n);
  return { width: plane.width, height: plane.height, data };
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
      if (acc === null) {
        acc = newAccumulator(method, d, n);
        // The first plane of integer samples is copied in natively: 0 + v, max(−Infinity, v) and v are all v for
        // an integer, and every accumulator holds these exactly (float samples take the loops: −0 and NaN).
        if (isIntegerArray(d)) { acc.set(d); count++; return; }
      } else if (!accepts(acc, d, count)) acc = Float64Array.from(acc);
      if (method === 'max') addMax(acc, d, n);
      else if (method === 'slice') copyInto(acc, d, n);
      else addSum(acc, d, n);
      count++;
    },
    result(into) {
      if (count === 0 || acc === null) throw new Error('no planes were added to the projection');
      if (into !== undefined && into.length !== n) throw new Error(`output holds ${into.length} values, the projection ${n}`);
      const out = into ?? new Float32Array(n);
      // Unscaled (max, sum, slice, a mean of one plane): a conversion, which TypedArray set does natively (acc · 1 = acc).
      if (method === 'mean' && count > 1) scaleInto(out, acc, 1 / count, n);
      else out.set(acc);
      return { width: widthPx, height: heightPx, data: out };
    },
  };
}
