import { createHash } from 'node:crypto';
import { copyFileSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BOUNDARY_COLUMNS, EMBRYO_COLUMNS, LANDMARK_COLUMNS, PROFILE_COLUMNS, resultsFromJson } from '../../core/batch';
import { parseCsv } from '../../core/csv';
import { cli, ensureBuilt, listing, tinyTiff } from './helpers';

// Demo data: 2 synthetic embryos written by `eggline demo --count 2`, plus hand-made bad files.
const dir = mkdtempSync(join(tmpdir(), 'eggline-cli-batch-'));
const demo = join(dir, 'demo');
const table = (path: string): Record<string, string>[] => {
  const [header, ...rows] = parseCsv(readFileSync(path, 'utf8'));
  return rows.map((r) => Object.fromEntries(header.map((h, i) => [h, r[i]])));
};

beforeAll(async () => {
  ensureBuilt();
  const r = await cli(['demo', demo, '--count', '2']);
  expect(r.code).toBe(0);
}, 180_000);
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('eggline demo', () => {
  it('writes the stacks, a sample sheet, a project with a furrow landmark per file and a README', () => {
    const files = listing(demo).map((l) => l.split(' ')[0]);
    expect(files.filter((f) => f.endsWith('.ome.tif'))).toHaveLength(2);
    expect(files).toEqual(expect.arrayContaining(['samples.csv', 'eggline-project.json', 'README.txt']));
    expect(parseCsv(readFileSync(join(demo, 'samples.csv'), 'utf8'))[0]).toEqual(['file', 'condition', 'dosage']);
    const project = JSON.parse(readFileSync(join(demo, 'eggline-project.json'), 'utf8'));
    expect(Object.values(project.files).every((e) => (e as { landmarks: { name: string }[] }).landmarks[0].name === 'furrow')).toBe(true);
    expect(readFileSync(join(demo, 'README.txt'), 'utf8')).toContain('synthetic demo data');
  });
});

describe('eggline batch on the demo set', () => {
  it('writes every table with all columns, one row per file, all ok, landmarks from the project, then the cohort report', async () => {
    const out = join(dir, 'out-demo');
    const before = listing(demo);
    // No --boundary-channel: the demo's project file names channel 2 as the boundary channel.
    const r = await cli(['batch', demo, '--out', out, '--jobs', '2', '--samples', join(demo, 'samples.csv')]);
    expect(r.stderr).toContain('using hand edits from');
    expect(r.code).toBe(0);
    expect(listing(demo)).toEqual(before);
    const embryos = parseCsv(readFileSync(join(out, 'embryos.csv'), 'utf8'));
    expect(embryos[0]).toEqual([...EMBRYO_COLUMNS]);
    expect(embryos).toHaveLength(3);
    expect(embryos.slice(1).map((row) => row[1])).toEqual(['ok', 'ok']);
    const boundaries = parseCsv(readFileSync(join(out, 'boundaries.csv'), 'utf8'));
    expect(boundaries[0]).toEqual([...BOUNDARY_COLUMNS]);
    expect(boundaries.length).toBeGreaterThan(1);
    expect(parseCsv(readFileSync(join(out, 'profiles.csv'), 'utf8'))[0]).toEqual([...PROFILE_COLUMNS]);
    const landmarks = table(join(out, 'landmarks.csv'));
    expect(parseCsv(readFileSync(join(out, 'landmarks.csv'), 'utf8'))[0]).toEqual([...LANDMARK_COLUMNS]);
    expect(landmarks.map((l) => l.name)).toEqual(['furrow', 'furrow']);
    expect(resultsFromJson(readFileSync(join(out, 'results.json'), 'utf8'))).toHaveLength(2);
    const run = JSON.parse(readFileSync(join(out, 'run.json'), 'utf8'));
    expect(r.stdout).toContain(`Cohort report: ${join(out, 'report.html')}`);
    expect(listing(out).map((l) => l.split(' ')[0])).toEqual(expect.arrayContaining(['report.html', 'conditions.csv']));
    // Source: node:crypto's SHA-256 of the whole file; the workers hash the bytes their decoder reads instead.
    for (const input of run.inputs as { file: string; sha256: string; bytes: number }[]) {
      const bytes = readFileSync(join(demo, input.file));
      expect(input).toMatchObject({ sha256: createHash('sha256').update(bytes).digest('hex'), bytes: bytes.length });
    }
  }, 180_000);
});

describe('eggline batch with bad files', () => {
  it('gives each bad file an error row naming it, analyses the rest, exits 1 and writes nothing into the input', async () => {
    const input = join(dir, 'mixed');
    mkdirSync(join(input, 'sub'), { recursive: true });
    const good = 'dosage-1x_embryo-01.ome.tif';
    copyFileSync(join(demo, good), join(input, good));
    const goodBytes = readFileSync(join(demo, good));
    writeFileSync(join(input, 'letter.tif'), 'Dear reader, this is not an image.');
    writeFileSync(join(input, 'empty.tif'), new Uint8Array(0));
    writeFileSync(join(input, 'sub', 'cut.ome.tif'), goodBytes.subarray(0, Math.floor(goodBytes.length / 2)));
    writeFileSync(join(input, 'loop.tif'), tinyTiff({ widthPx: 4, heightPx: 3, ifdLoop: true }));
    writeFileSync(join(input, 'huge.tif'), tinyTiff({ widthPx: 200_000, heightPx: 200_000 }));
    writeFileSync(join(input, 'odd, "quoted".tif'), 'not a tiff either');
    const before = listing(input);
    const out = join(dir, 'out-mixed');
    const r = await cli(['batch', input, '--out', out, '--jobs', '2']);
    expect(r.code).toBe(1);
    expect(listing(input)).toEqual(before);
    const rows = table(join(out, 'embryos.csv'));
    // Files in code-unit order of their relative paths.
    expect(rows.map((row) => row.file)).toEqual([good, 'empty.tif', 'huge.tif', 'letter.tif', 'loop.tif', 'odd, "quoted".tif', 'sub/cut.ome.tif']);
    const byFile = Object.fromEntries(rows.map((row) => [row.file, row]));
    expect(byFile[good].status).toBe('ok');
    for (const bad of ['empty.tif', 'huge.tif', 'letter.tif', 'loop.tif', 'odd, "quoted".tif', 'sub/cut.ome.tif']) {
      expect(byFile[bad].status, bad).toBe('error');
      expect(byFile[bad].error.startsWith(`${bad}: `), byFile[bad].error).toBe(true);
      expect(byFile[bad].error).not.toContain('\n');
    }
    // Source: RFC 4180 §2 rules 6–7 — a field with a comma and quotes is enclosed in quotes, inner quotes doubled
    expect(readFileSync(join(out, 'embryos.csv'), 'utf8')).toContain('\r\n"odd, ""quoted"".tif",error,"odd, ""quoted"".tif: ');
    expect(r.stderr).toMatch(/\[\d\/7\] error loop\.tif: /);
  }, 180_000);
});
