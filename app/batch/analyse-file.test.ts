import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS } from '../../core/settings';
import { makeSyntheticEmbryo } from '../../core/synth';
import { writeOmeTiff } from '../../core/tiff';
import { analyseFile, analyseFileWithDigest } from './analyse-file';
import type { BatchTask } from './task';

const dir = mkdtempSync(join(tmpdir(), 'eggline-analyse-file-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('analyseFileWithDigest', () => {
  it("gives the SHA-256 of the whole file from the decoder's reads (run.json's digest, the file read once) and its time shape", async () => {
    // demo data: a small synthetic embryo as a Deflate OME-TIFF
    const e = makeSyntheticEmbryo({ widthPx: 160, heightPx: 96, sizeZ: 3, pixelSizeUm: 4, zStepUm: 2 }, 5);
    const bytes = writeOmeTiff(e.stack.planes.map((data) => ({ width: 160, height: 96, data })), {
      sizeZ: 3, sizeC: e.channelNames.length, sizeT: 1, dimensionOrder: 'XYZCT', channelNames: [...e.channelNames], physicalSizeXUm: e.pixelSizeUm, compression: 'deflate',
    });
    const path = join(dir, 'embryo.ome.tif');
    writeFileSync(path, bytes);
    const { input, shape } = await analyseFileWithDigest({ index: 0, path, file: 'embryo.ome.tif', settings: DEFAULT_SETTINGS, handEdits: null });
    // Source: node:crypto's SHA-256 (OpenSSL) of the file read in one piece.
    expect(input).toEqual({ sha256: createHash('sha256').update(readFileSync(path)).digest('hex'), bytes: bytes.length });
    expect(shape).toEqual({ sizeT: 1, sizeZ: 3, isOme: true });
  });

  it('gives the digest of a file that is not a TIFF when the decoder read it whole, and none for a missing file', async () => {
    const path = join(dir, 'not-a-tiff.tif');
    writeFileSync(path, 'not a TIFF at all');
    const bad = await analyseFileWithDigest({ index: 0, path, file: 'not-a-tiff.tif', settings: DEFAULT_SETTINGS, handEdits: null });
    expect(bad.result.status).toBe('error');
    // Source: node:crypto's SHA-256 (OpenSSL) of the file read in one piece.
    expect(bad.input).toEqual({ sha256: createHash('sha256').update('not a TIFF at all').digest('hex'), bytes: 17 });
    expect(bad.shape).toBeNull();
    const missing = await analyseFileWithDigest({ index: 1, path: join(dir, 'gone.tif'), file: 'gone.tif', settings: DEFAULT_SETTINGS, handEdits: null });
    expect(missing.result.status).toBe('error');
    expect(missing.input).toBeNull();
  });
});

describe('the shared time point (settings.timeIndex) past a file\'s last time point', () => {
  // demo data: one small synthetic embryo, written as a single stack and as a 3-time-point movie whose time point t is
  // the embryo's planes times (1 + t) (so each time point has its own fit amplitude).
  const e = makeSyntheticEmbryo({ widthPx: 160, heightPx: 96, sizeZ: 2, pixelSizeUm: 4, zStepUm: 2 }, 7);
  const write = (name: string, sizeT: number): string => {
    const planes = Array.from({ length: sizeT }, (_, t) => e.stack.planes.map((data) => ({ width: 160, height: 96, data: Uint16Array.from(data, (v) => v * (1 + t)) }))).flat();
    const path = join(dir, name);
    writeFileSync(path, writeOmeTiff(planes, {
      sizeZ: 2, sizeC: e.channelNames.length, sizeT, dimensionOrder: 'XYZCT', channelNames: [...e.channelNames], physicalSizeXUm: e.pixelSizeUm,
    }));
    return path;
  };
  const single = write('single.ome.tif', 1);
  const movie = write('short-movie.ome.tif', 3);
  const task = (path: string, file: string, timeIndex: number, over: Partial<BatchTask> = {}): BatchTask =>
    ({ index: 0, path, file, settings: { ...DEFAULT_SETTINGS, timeIndex }, handEdits: null, ...over });
  const withoutWarnings = ({ warnings: _w, ...rest }: Awaited<ReturnType<typeof analyseFile>>) => rest;

  it('analyses a single stack at its only time point, with a warning naming the file, the asked and the used time point', async () => {
    const asked = await analyseFile(task(single, 'single.ome.tif', 5));
    const zero = await analyseFile(task(single, 'single.ome.tif', 0));
    expect(asked.status).toBe('ok');
    expect(asked.tIndex ?? 0).toBe(0);
    expect(withoutWarnings(asked)).toEqual(withoutWarnings(zero));
    expect(asked.warnings).toEqual([...zero.warnings, 'single.ome.tif: time point 5 asked for (--time-index, 0-based), but the file has one time point; time point 0 was analysed']);
  });

  it('analyses a shorter movie at its last time point, with the edits in force there', async () => {
    const asked = await analyseFile(task(movie, 'short-movie.ome.tif', 5));
    const last = await analyseFile(task(movie, 'short-movie.ome.tif', 2));
    expect(asked.status).toBe('ok');
    expect(asked.tIndex).toBe(2);
    expect(withoutWarnings(asked)).toEqual(withoutWarnings(last));
    expect(asked.warnings.at(-1)).toBe('short-movie.ome.tif: time point 5 asked for (--time-index, 0-based), but the file has 3 time points (0 to 2); time point 2 was analysed');
    // A hand axis the project sets for time point 2 alone holds there; the file's own edits elsewhere.
    const hand = { anterior: { x: 20, y: 48 }, posterior: { x: 140, y: 48 }, source: 'hand' as const };
    const own = { settings: { ...DEFAULT_SETTINGS, timeIndex: 5 }, handEdits: null };
    const edited = await analyseFile(task(movie, 'short-movie.ome.tif', 5, { timePointEdits: { own, at: { 2: { settings: own.settings, handEdits: { axis: hand, landmarks: [] } } } } }));
    expect(edited.axis).toEqual(hand);
    const elsewhere = await analyseFile(task(movie, 'short-movie.ome.tif', 5, { timePointEdits: { own, at: { 1: { settings: own.settings, handEdits: { axis: hand, landmarks: [] } } } } }));
    expect(withoutWarnings(elsewhere)).toEqual(withoutWarnings(last));
  });

  it('changes nothing when the file has the asked time point', async () => {
    const r = await analyseFile(task(movie, 'short-movie.ome.tif', 1));
    expect(r.tIndex).toBe(1);
    expect(r.warnings.some((w) => w.includes('asked for'))).toBe(false);
  });
});
