import { describe, expect, it } from 'vitest';
import { countRunSamples, runCounter, runCounterModuleBytes } from './run-counter';
import { counterMedian, sampleMedian } from './median-whole';
import { maskRuns } from './runs';
import { maskedMedian } from './select';

/** Seeded uniform numbers in [0, 1) (demo data). */
function lcg(seed: number): () => number {
  let s = seed >>> 0;
  return () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 2 ** 32);
}

describe('runCounter', () => {
  it('is a valid WebAssembly module that Node compiles', () => {
    // Source: WebAssembly Core Specification 1.0 §5.5.16 — a module starts with the magic "\0asm" and version 1.
    const bytes = runCounterModuleBytes();
    expect(Array.from(bytes.subarray(0, 8))).toEqual([0x00, 0x61, 0x73, 0x6d, 0x01, 0x00, 0x00, 0x00]);
    const wasm = (globalThis as unknown as { WebAssembly: { Module: new (b: Uint8Array) => object } }).WebAssembly;
    expect(() => new wasm.Module(bytes)).not.toThrow();
  });

  it('counts the same lanes as the JavaScript loop and gives sampleMedian\'s median, plane after plane', () => {
    // Reference: countRunSamples (the JavaScript loop) and maskedMedian (radix selection) on the same samples; demo
    // data: seeded noise with saturated and zero samples, masks of random blobs so runs of every length 1…width,
    // starting at odd and even positions, and several planes through one counter (its lanes must be zero again).
    for (const [seed, width, height] of [[1, 64, 48], [2, 97, 61], [3, 513, 257], [4, 5, 3]] as const) {
      const rnd = lcg(seed);
      const n = width * height;
      const keep = new Uint8Array(n);
      for (let i = 0; i < n; i++) keep[i] = +(rnd() < (i % width < width / 2 ? 0.85 : 0.35));
      const runs = maskRuns({ width, height, data: keep }, true);
      const wasm = runCounter(runs, n);
      const plain = runCounter(runs, n, false);
      expect(wasm.compiled).toBe(true);
      expect(plain.compiled).toBe(false);
      for (let plane = 0; plane < 3; plane++) {
        const samples = new Uint16Array(n);
        for (let i = 0; i < n; i++) {
          const u = rnd();
          samples[i] = u < 0.03 ? 65_535 : u < 0.06 ? 0 : u < 0.2 ? Math.floor(rnd() * 65_536) : 300 + Math.floor(rnd() * 40);
        }
        const reference = new Uint32Array(4 * 65_536);
        const count = countRunSamples(samples, runs, reference);
        expect(wasm.count(samples)).toBe(count);
        expect(wasm.lanes).toEqual(reference);
        wasm.lanes.fill(0);
        const expected = maskedMedian(Float32Array.from(samples), keep);
        expect(counterMedian(wasm, samples)).toEqual(expected);
        expect(wasm.lanes.every((v) => v === 0)).toBe(true);
        expect(counterMedian(plain, samples)).toEqual(expected);
        expect(sampleMedian(samples, runs)).toEqual(expected);
      }
      // 8-bit planes and planes of another size are counted by the JavaScript loop, with the same answer.
      const bytes = Uint8Array.from({ length: n }, () => Math.floor(rnd() * 256));
      expect(counterMedian(wasm, bytes)).toEqual(maskedMedian(Float32Array.from(bytes), keep));
      expect(wasm.lanes.every((v) => v === 0)).toBe(true);
    }
  });

  it('counts planes over 64 MiB in JavaScript (no copy that large)', () => {
    // Demo data: runs over a 6000 × 6000 plane (72 MB of 16-bit samples); only the counter's kind is checked.
    const runs = { start: Int32Array.from([0]), end: Int32Array.from([10]), rowFirst: new Int32Array(1), count: 1 };
    expect(runCounter(runs, 6000 * 6000).compiled).toBe(false);
    expect(runCounter(runs, 4000 * 4000).compiled).toBe(true);
  });

  it('gives null for runs that hold no pixel', () => {
    // Source: the median of no values is undefined (from memory).
    const runs = maskRuns({ width: 4, height: 2, data: new Uint8Array(8) }, true);
    expect(counterMedian(runCounter(runs, 8), new Uint16Array(8))).toBeNull();
  });
});
