import { mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { cli, ensureBuilt, tinyTiff } from './helpers';

// Source for expected messages and exit codes: this project's command-line rules (0 ok, 1 some failed, 2 usage).
const dir = mkdtempSync(join(tmpdir(), 'eggline-cli-usage-'));
const empty = join(dir, 'empty');
beforeAll(() => { ensureBuilt(); mkdirSync(empty); });
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('eggline usage errors (exit 2, one line, hint to --help)', () => {
  it.each([
    [['batch', empty, '--out', join(dir, 'o'), '--bogus'], 'eggline batch: unknown option --bogus (see "eggline batch --help")'],
    [['batch', '--out', join(dir, 'o')], 'eggline batch: missing the input folder (see "eggline batch --help")'],
    [['batch', join(dir, 'missing'), '--out', join(dir, 'o')], `eggline batch: input folder not found: ${join(dir, 'missing')} (see "eggline batch --help")`],
    [['batch', empty], 'eggline batch: missing --out <dir> (where the tables go) (see "eggline batch --help")'],
    [['batch', empty, '--out', empty], 'eggline batch: --out must not be the input folder (nothing is written next to the inputs) (see "eggline batch --help")'],
    [['batch', empty, '--out', join(dir, 'o'), '--fit-range', '0.8,0.2'],
      'eggline batch: --fit-range must be two numbers 0 ≤ a < b ≤ 1 written as a,b (got "0.8,0.2") (see "eggline batch --help")'],
    [['batch', empty, '--out', join(dir, 'o'), '--jobs', 'many'], 'eggline batch: --jobs must be a whole number from 1 to 256 (got "many") (see "eggline batch --help")'],
    [['batch', empty, '--out', join(dir, 'o'), '--jobs'], 'eggline batch: option --jobs needs a value (see "eggline batch --help")'],
    [['batch', empty, '--out', join(dir, 'o'), '--reference', 'wt'], 'eggline batch: --reference needs --samples (see "eggline batch --help")'],
    [['frobnicate'], 'eggline: unknown command "frobnicate" (see "eggline --help")'],
    [['inspect'], 'eggline inspect: missing the file to inspect (see "eggline inspect --help")'],
  ])('%j', async (args, message) => {
    const r = await cli(args);
    expect(r.code).toBe(2);
    expect(r.stderr.trim().split('\n')).toEqual([message]);
    expect(r.stdout).toBe('');
  });
  it('no arguments prints the help on stderr with exit 2; --help and --version exit 0', async () => {
    const none = await cli([]);
    expect([none.code, none.stderr.includes('eggline batch <folder> --out <dir>')]).toEqual([2, true]);
    const help = await cli(['batch', '--help']);
    expect([help.code, help.stdout.startsWith('Usage: eggline batch <folder> --out <dir>')]).toEqual([0, true]);
    const version = await cli(['--version']);
    // Source: package.json "version"
    expect(version.stdout.trim()).toBe(`eggline ${JSON.parse(readFileSync('package.json', 'utf8')).version}`);
  });
});

describe('eggline inspect', () => {
  it('describes a plain TIFF from its tags', async () => {
    // Source: TIFF 6.0 §8 — the hand-built file has one 4×3 uint16 plane, no compression, no resolution tags
    const file = join(dir, 'tiny.tif');
    writeFileSync(file, tinyTiff({ widthPx: 4, heightPx: 3 }));
    const r = await cli(['inspect', file]);
    expect(r.code).toBe(0);
    expect(r.stdout).toContain('dimensions: X 4 × Y 3 × Z 1 × C 1 × T 1');
    expect(r.stdout).toContain('sample type: uint16');
    expect(r.stdout).toMatch(/pixel size: unknown/);
  });
  it('--json gives the same facts as one JSON object with the documented keys', async () => {
    // Source: TIFF 6.0 §8 — the hand-built file has one 4×3 uint16 plane, no compression, no resolution tags
    const file = join(dir, 'tiny-json.tif');
    writeFileSync(file, tinyTiff({ widthPx: 4, heightPx: 3 }));
    const r = await cli(['inspect', '--json', file]);
    expect(r.code).toBe(0);
    const facts = JSON.parse(r.stdout);
    expect(Object.keys(facts)).toEqual([
      'file', 'schema', 'version', 'format', 'bigTiff', 'byteOrder', 'ifdCount', 'sizeX', 'sizeY', 'sizeZ', 'sizeC', 'sizeT',
      'dimensionOrder', 'channels', 'pixelSizeXUm', 'pixelSizeYUm', 'pixelSizeSource', 'zStepUm', 'timeIncrementS', 'timesS',
      'timeSource', 'sampleType', 'samplesPerPixel', 'compression', 'compressionCode', 'planeMap', 'warnings',
    ]);
    expect(facts).toMatchObject({
      file, schema: 'eggline-inspect', version: 1, format: 'TIFF', sizeX: 4, sizeY: 3, sizeZ: 1, sizeC: 1, sizeT: 1,
      channels: [{ index: 1, name: 'C0' }], pixelSizeXUm: null, pixelSizeSource: 'unknown', sampleType: 'uint16',
      compression: 'none', compressionCode: 1, planeMap: [{ t: 0, c: 0, ifds: [0] }],
    });
    expect(facts.warnings).toEqual(expect.arrayContaining([expect.stringMatching(/pixel size unknown/)]));
  });
  it('names the file and the problem for a file that is not a TIFF (exit 1)', async () => {
    const file = join(dir, 'notes.tif');
    writeFileSync(file, 'just some text');
    const r = await cli(['inspect', file]);
    expect(r.code).toBe(1);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/^eggline inspect: notes\.tif: /);
  });
});

describe('settings precedence: defaults < --config < flags (recorded in run.json)', () => {
  it('flags win over the config file, the config over defaults', async () => {
    const config = join(dir, 'settings.json');
    writeFileSync(config, JSON.stringify({ fitRangeEl: [0.2, 0.7], anterior: 'low', profile: { edgeDepthUm: 8, mode: 'axis' } }));
    const out = join(dir, 'out-precedence');
    const r = await cli(['batch', empty, '--out', out, '--config', config, '--fit-range', '0.15,0.5', '--profile', 'edge', '--jobs', '1']);
    expect(r.code).toBe(1);
    expect(r.stderr).toContain('no stacks');
    const run = JSON.parse(readFileSync(join(out, 'run.json'), 'utf8'));
    // Source: DEFAULT_SETTINGS (core/settings) for the untouched values
    expect(run.settings.fitRangeEl).toEqual([0.15, 0.5]);
    expect(run.settings.anterior).toBe('low');
    expect(run.settings.profile.mode).toBe('edge');
    expect(run.settings.profile.edgeDepthUm).toBe(8);
    expect(run.settings.projection).toBe('mean');
  });
  it('a bad config file is a usage error naming the file and the setting', async () => {
    const config = join(dir, 'bad.json');
    writeFileSync(config, JSON.stringify({ fitRangeEl: [0.7, 0.2] }));
    const r = await cli(['batch', empty, '--out', join(dir, 'o3'), '--config', config]);
    expect(r.code).toBe(2);
    expect(r.stderr.trim()).toBe(`eggline batch: ${config}: "fitRangeEl" must be two numbers [a, b] with 0 ≤ a < b ≤ 1 (see "eggline batch --help")`);
  });
});
