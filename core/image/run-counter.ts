// Counting the 8/16-bit samples of a fixed set of pixel runs, plane after plane (a movie's background pixels at every
// time point): four lanes of 65 536 counts, as countRunSamples below fills them. For 16-bit planes the counting loop
// runs as a small WebAssembly function (no bounds check per count: about half the JavaScript loop's time per plane,
// the plane's copy included, in a CPU profile of the movie bench), over a copy of the plane in its own memory; where
// WebAssembly cannot be compiled (a page whose Content-Security-Policy forbids it), for 8-bit planes and for planes
// over 64 MiB (the copy would cost as much memory), the JavaScript loop counts instead. Either way the same counts,
// so the same medians.
import type { MaskRuns } from './runs';

/** Counts of one run set's samples, one plane at a time. */
export interface RunCounter {
  /** Four lanes of 65 536 counts (value v of lane j at v + 65 536·j); all zero between planes. */
  readonly lanes: Uint32Array;
  /** Adds each sample of the runs to one of the four lanes (the WebAssembly loop as countRunSamples does, position mod 4
   *  within the run; the JavaScript one as countSamples does); returns how many were counted. `samples` is a whole plane
   *  (the runs index it). */
  count(samples: Uint8Array | Uint16Array): number;
  /** True when 16-bit planes are counted by the WebAssembly loop. */
  readonly compiled: boolean;
}

const LANE = 65_536;
const LANES_BYTES = 4 * LANE * 4;
/** Largest plane (bytes) copied into a counter's memory; larger ones are counted in JavaScript. */
const MAX_COPIED_PLANE_BYTES = 64 * 2 ** 20;

/** counts[v + 65 536·j] += 1 for each sample v of runs, lane j = position mod 4 within a run. */
export function countRunSamples(samples: Uint8Array | Uint16Array, runs: MaskRuns, counts: Uint32Array): number {
  let n = 0;
  for (let r = 0; r < runs.count; r++) {
    const end = runs.end[r];
    let i = runs.start[r];
    n += end - i;
    for (; i + 3 < end; i += 4) {
      counts[samples[i]]++;
      counts[samples[i + 1] + LANE]++;
      counts[samples[i + 2] + 2 * LANE]++;
      counts[samples[i + 3] + 3 * LANE]++;
    }
    for (; i < end; i++) counts[samples[i]]++;
  }
  return n;
}

/**
 * countRunSamples for 16-bit samples read two at a time as 32-bit words (`words` views the same bytes; a sample's lane
 * is whichever half of a word it sits in, so the byte order does not matter): half the loads and bounds checks.
 */
function countSampleWords(samples: Uint16Array, words: Uint32Array, runs: MaskRuns, counts: Uint32Array): number {
  let n = 0;
  for (let r = 0; r < runs.count; r++) {
    const end = runs.end[r];
    let i = runs.start[r];
    n += end - i;
    if ((i & 1) === 1 && i < end) counts[samples[i++]]++;
    let k = i >> 1;
    const wordsEnd = end >> 1;
    for (; k + 1 < wordsEnd; k += 2) {
      const w0 = words[k];
      const w1 = words[k + 1];
      counts[w0 & 0xffff]++;
      counts[(w0 >>> 16) + 65_536]++;
      counts[(w1 & 0xffff) + 131_072]++;
      counts[(w1 >>> 16) + 196_608]++;
    }
    if (k < wordsEnd) {
      const w = words[k];
      counts[w & 0xffff]++;
      counts[(w >>> 16) + 65_536]++;
    }
    if ((end & 1) === 1 && end - 1 >= i) counts[samples[end - 1]]++;
  }
  return n;
}

/** The counting loop JavaScript runs: two 16-bit samples per 32-bit load when the plane's bytes allow such a view
 *  (countSampleWords), else countRunSamples. The same counts per value; only which lane holds a count differs. */
export function countSamples(samples: Uint8Array | Uint16Array, runs: MaskRuns, counts: Uint32Array): number {
  return samples instanceof Uint16Array && samples.byteOffset % 4 === 0
    ? countSampleWords(samples, new Uint32Array(samples.buffer, samples.byteOffset, samples.length >> 1), runs, counts)
    : countRunSamples(samples, runs, counts);
}

// --- A minimal WebAssembly encoder for the one function below (WebAssembly Core Specification 1.0, §5 Binary
// Format: LEB128 integers, sections, the instructions used). ---

/** Unsigned LEB128 (spec §5.2.2). */
function uleb(n: number): number[] {
  const out: number[] = [];
  do {
    let b = n & 0x7f;
    n >>>= 7;
    if (n !== 0) b |= 0x80;
    out.push(b);
  } while (n !== 0);
  return out;
}

/** Signed LEB128 (spec §5.2.2). */
function sleb(n: number): number[] {
  const out: number[] = [];
  for (;;) {
    const b = n & 0x7f;
    n >>= 7;
    if ((n === 0 && (b & 0x40) === 0) || (n === -1 && (b & 0x40) !== 0)) { out.push(b); return out; }
    out.push(b | 0x80);
  }
}

const vec = (items: readonly (readonly number[])[]): number[] => [...uleb(items.length), ...items.flat()];
const section = (id: number, body: readonly number[]): number[] => [id, ...uleb(body.length), ...body];
const name = (s: string): number[] => vec([...s].map((ch) => [ch.charCodeAt(0)]));
const I32 = 0x7f;
const get = (i: number) => [0x20, ...uleb(i)];
const set = (i: number) => [0x21, ...uleb(i)];
const tee = (i: number) => [0x22, ...uleb(i)];
const konst = (v: number) => [0x41, ...sleb(v)];
const ADD = 0x6a, SUB = 0x6b, SHL = 0x74, SHR_U = 0x76, GE_U = 0x4f;
const load32 = (offset: number) => [0x28, 0x02, ...uleb(offset)];
const store32 = (offset: number) => [0x36, 0x02, ...uleb(offset)];
const load16u = (offset: number) => [0x2f, 0x01, ...uleb(offset)];
const BLOCK = [0x02, 0x40], LOOP = [0x03, 0x40], END = 0x0b;
const br = (depth: number) => [0x0c, ...uleb(depth)];
const brIf = (depth: number) => [0x0d, ...uleb(depth)];

// count(samples, runStarts, runEnds, runCount) → n, all byte addresses into the one memory; the lanes at address 0.
// Locals: 0 samples, 1 runStarts, 2 runEnds, 3 runCount, 4 r, 5 at (byte address of the sample), 6 end (byte
// address), 7 n, 8 slot.
const P_SAMPLES = 0, P_STARTS = 1, P_ENDS = 2, P_COUNT = 3, L_R = 4, L_AT = 5, L_END = 6, L_N = 7, L_SLOT = 8;

/** lanes[lane][sample at `at` + byteOffset] += 1 */
function increment(byteOffset: number, lane: number): number[] {
  return [
    ...get(L_AT), ...load16u(byteOffset), ...konst(2), SHL, ...tee(L_SLOT),
    ...get(L_SLOT), ...load32(lane * LANE * 4), ...konst(1), ADD, ...store32(lane * LANE * 4),
  ];
}

/** The byte address of sample index list[r]: samples + 2·list[r]. */
function sampleAddress(list: number): number[] {
  return [...get(P_SAMPLES), ...get(list), ...get(L_R), ...konst(2), SHL, ADD, ...load32(0), ...konst(1), SHL, ADD];
}

function countFunction(): number[] {
  const body = [
    ...BLOCK, ...LOOP,
    ...get(L_R), ...get(P_COUNT), GE_U, ...brIf(1),
    ...sampleAddress(P_STARTS), ...set(L_AT),
    ...sampleAddress(P_ENDS), ...set(L_END),
    ...get(L_N), ...get(L_END), ...get(L_AT), SUB, ...konst(1), SHR_U, ADD, ...set(L_N),
    // Four samples at a time while at + 6 < end, one lane each.
    ...BLOCK, ...LOOP,
    ...get(L_AT), ...konst(6), ADD, ...get(L_END), GE_U, ...brIf(1),
    ...increment(0, 0), ...increment(2, 1), ...increment(4, 2), ...increment(6, 3),
    ...get(L_AT), ...konst(8), ADD, ...set(L_AT), ...br(0),
    END, END,
    // The rest into lane 0.
    ...BLOCK, ...LOOP,
    ...get(L_AT), ...get(L_END), GE_U, ...brIf(1),
    ...increment(0, 0),
    ...get(L_AT), ...konst(2), ADD, ...set(L_AT), ...br(0),
    END, END,
    ...get(L_R), ...konst(1), ADD, ...set(L_R), ...br(0),
    END, END,
    ...get(L_N), END,
  ];
  return [...vec([[5, I32]]), ...body];
}

/** The module: imports env.memory, exports count(i32 × 4) → i32. */
export function runCounterModuleBytes(): Uint8Array {
  const fn = countFunction();
  return new Uint8Array([
    0x00, 0x61, 0x73, 0x6d, 0x01, 0x00, 0x00, 0x00,
    ...section(1, vec([[0x60, ...vec([[I32], [I32], [I32], [I32]]), ...vec([[I32]])]])),
    ...section(2, vec([[...name('env'), ...name('memory'), 0x02, 0x00, ...uleb(1)]])),
    ...section(3, vec([[0]])),
    ...section(7, vec([[...name('count'), 0x00, 0]])),
    ...section(10, vec([[...uleb(fn.length), ...fn]])),
  ]);
}

/** The parts of the WebAssembly JavaScript API used here (core is typed without the DOM's and Node's globals). */
interface WasmApi {
  readonly Module: new (bytes: Uint8Array) => object;
  readonly Instance: new (module: object, imports: object) => { readonly exports: Record<string, unknown> };
  readonly Memory: new (descriptor: { initial: number }) => { readonly buffer: ArrayBuffer };
}

const wasmApi: WasmApi | undefined = (globalThis as { WebAssembly?: WasmApi }).WebAssembly;

let compiledModule: object | null | undefined;

/** The compiled module, or null where WebAssembly is missing or refused (compiled once per process: a pure cache). */
function counterModule(): object | null {
  if (compiledModule === undefined) {
    try {
      compiledModule = wasmApi ? new wasmApi.Module(runCounterModuleBytes()) : null;
    } catch {
      compiledModule = null;
    }
  }
  return compiledModule;
}

/** A counter in JavaScript alone: lanes of its own, countSamples. */
function plainCounter(runs: MaskRuns): RunCounter {
  const lanes = new Uint32Array(4 * LANE);
  return { lanes, compiled: false, count: (samples) => countSamples(samples, runs, lanes) };
}

/**
 * A counter for the samples of `runs` in planes of `planeValues` samples. With WebAssembly, one memory holds the
 * lanes, the runs (copied once) and a copy of the plane being counted (written at each 16-bit count).
 */
export function runCounter(runs: MaskRuns, planeValues: number, useWasm = true): RunCounter {
  const compiled = useWasm ? counterModule() : null;
  if (compiled === null || !wasmApi) return plainCounter(runs);
  const startsAt = LANES_BYTES;
  const endsAt = startsAt + 4 * runs.count;
  const samplesAt = endsAt + 4 * runs.count;
  const bytes = samplesAt + 2 * planeValues;
  if (2 * planeValues > MAX_COPIED_PLANE_BYTES) return plainCounter(runs);
  let instance: { readonly exports: Record<string, unknown> };
  let memory: { readonly buffer: ArrayBuffer };
  try {
    memory = new wasmApi.Memory({ initial: Math.ceil(bytes / 65_536) });
    instance = new wasmApi.Instance(compiled, { env: { memory } });
  } catch {
    return plainCounter(runs);
  }
  const buffer = memory.buffer;
  new Int32Array(buffer, startsAt, runs.count).set(runs.start.subarray(0, runs.count));
  new Int32Array(buffer, endsAt, runs.count).set(runs.end.subarray(0, runs.count));
  const lanes = new Uint32Array(buffer, 0, 4 * LANE);
  const plane = new Uint16Array(buffer, samplesAt, planeValues);
  const count = instance.exports.count as (samples: number, starts: number, ends: number, runCount: number) => number;
  return {
    lanes,
    compiled: true,
    count(samples) {
      if (!(samples instanceof Uint16Array) || samples.length !== planeValues) return countSamples(samples, runs, lanes);
      plane.set(samples);
      return count(samplesAt, startsAt, endsAt, runs.count);
    },
  };
}
