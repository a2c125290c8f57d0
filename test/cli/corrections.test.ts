// --flat and --background-image through the real command line (demo data: one synthetic embryo from `eggline demo`).
import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseCsv } from '../../core/csv';
import { writeOmeTiff } from '../../core/tiff';
import { cli, ensureBuilt } from './helpers';

const dir = mkdtempSync(join(tmpdir(), 'eggline-cli-corrections-'));
const demo = join(dir, 'demo');
let size = { x: 0, y: 0 };

/** A two-channel, one-slice float32 OME-TIFF whose every pixel is `value`. */
function flatImage(path: string, x: number, y: number, value: number): void {
  const plane = { width: x, height: y, data: new Float32Array(x * y).fill(value) };
  writeFileSync(path, writeOmeTiff([plane, plane], { sizeZ: 1, sizeC: 2, sizeT: 1, dimensionOrder: 'XYZCT', channelNames: ['a', 'b'], physicalSizeXUm: 1.5 }));
}
const lambdas = (out: string): string[] => {
  const [header, ...rows] = parseCsv(readFileSync(join(out, 'embryos.csv'), 'utf8'));
  return rows.map((r) => r[header.indexOf('lambda_um')]);
};

beforeAll(async () => {
  ensureBuilt();
  expect((await cli(['demo', demo, '--count', '1'])).code).toBe(0);
  const file = readFileSync(join(demo, 'samples.csv'), 'utf8').split('\n')[1].split(',')[0];
  const info = JSON.parse((await cli(['inspect', '--json', join(demo, file)])).stdout);
  size = { x: info.sizeX, y: info.sizeY };
}, 180_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('eggline batch --flat / --background-image', () => {
  it('a uniform flat and a zero background leave λ unchanged, and run.json records both files with their SHA-256', async () => {
    const flat = join(dir, 'flat.ome.tif');
    const dark = join(dir, 'dark.ome.tif');
    flatImage(flat, size.x, size.y, 7);
    flatImage(dark, size.x, size.y, 0);
    const plain = await cli(['batch', demo, '--out', join(dir, 'plain'), '--jobs', '1']);
    const corrected = await cli(['batch', demo, '--out', join(dir, 'corrected'), '--jobs', '1', '--flat', flat, '--background-image', dark]);
    expect([plain.code, corrected.code]).toEqual([0, 0]);
    expect(lambdas(join(dir, 'corrected'))).toEqual(lambdas(join(dir, 'plain')));
    const run = JSON.parse(readFileSync(join(dir, 'corrected', 'run.json'), 'utf8'));
    const sha = (p: string): string => createHash('sha256').update(readFileSync(p)).digest('hex');
    expect(run.corrections).toEqual({ flatField: { file: flat, sha256: sha(flat) }, backgroundImage: { file: dark, sha256: sha(dark) } });
    expect([run.settings.flatFieldFile, run.settings.backgroundImageFile]).toEqual([flat, dark]);
  }, 180_000);

  it('--resume reuses results only while the flat file\'s bytes are unchanged', async () => {
    const flat = join(dir, 'flat-resume.ome.tif');
    const out = join(dir, 'resume');
    flatImage(flat, size.x, size.y, 7);
    expect((await cli(['batch', demo, '--out', out, '--jobs', '1', '--flat', flat])).code).toBe(0);
    expect((await cli(['batch', demo, '--out', out, '--jobs', '1', '--flat', flat, '--resume'])).code).toBe(0);
    expect(JSON.parse(readFileSync(join(out, 'run.json'), 'utf8')).reused).toBe(1);
    flatImage(flat, size.x, size.y, 3); // same path, other bytes
    expect((await cli(['batch', demo, '--out', out, '--jobs', '1', '--flat', flat, '--resume'])).code).toBe(0);
    expect(JSON.parse(readFileSync(join(out, 'run.json'), 'utf8')).reused).toBe(0);
  }, 180_000);

  it('a flat of another size gives each stack an error row of one line naming both, and exit 1', async () => {
    const small = join(dir, 'small.ome.tif');
    flatImage(small, 10, 10, 1);
    const r = await cli(['batch', demo, '--out', join(dir, 'small'), '--jobs', '1', '--flat', small]);
    expect(r.code).toBe(1);
    const [header, ...rows] = parseCsv(readFileSync(join(dir, 'small', 'embryos.csv'), 'utf8'));
    expect(rows.map((row) => row[header.indexOf('error')])).toEqual([expect.stringMatching(new RegExp(`: the flat-field image ${small.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')} is 10×10 px but the stack is ${size.x}×${size.y} px$`))]);
  }, 180_000);

  it('a missing flat stops the batch before it starts, with one line (exit 2)', async () => {
    const r = await cli(['batch', demo, '--out', join(dir, 'missing'), '--flat', join(dir, 'nope.tif')]);
    expect(r.code).toBe(2);
    // The demo's project file adds its own note line ("using hand edits from …") before the refusal.
    const lines = r.stderr.trim().split('\n').filter((l) => !l.startsWith('eggline: using hand edits'));
    expect(lines).toEqual([`eggline batch: flat-field image ${join(dir, 'nope.tif')}: cannot open file (no such file) (see "eggline batch --help")`]);
  }, 60_000);
});
