import { mkdtempSync, readFileSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { parseCsv } from '../../core/csv';
import { DEMO_MOVIE_FILE, DEMO_MOVIE_PARAMS, demoDataSet } from '../../core/synth';
import { memoryByteSource, readStackInfo } from '../../core/tiff';
import { demoMovieFile, demoSubset, writeDemoDataSet } from './write-demo';

// Source: demo data (core/synth's invented dosage series); the expected names come from demoDataSet itself.
const dir = mkdtempSync(join(tmpdir(), 'eggline-demo-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('demoSubset', () => {
  it('spreads a subset over the conditions, in file-name order', () => {
    const all = demoDataSet();
    const four = demoSubset(all, 4);
    expect(new Set(four.map((i) => i.condition)).size).toBe(4);
    expect(four.map((i) => i.fileName)).toEqual([...four.map((i) => i.fileName)].sort());
    expect(demoSubset(all)).toHaveLength(all.length);
    expect(() => demoSubset(all, 0)).toThrow('demo subset must be a whole number ≥ 1 (got 0)');
  });
});

describe('writeDemoDataSet (in this thread)', () => {
  it('writes an OME-TIFF per item, the sample sheet, a project with the furrow landmark and a README', async () => {
    const r = await writeDemoDataSet(dir, { subset: 1 });
    const item = demoSubset(demoDataSet(), 1)[0];
    expect(r.files).toEqual([join(dir, item.fileName)]);
    expect(readdirSync(dir).sort()).toEqual(['README.txt', 'eggline-project.json', item.fileName, 'samples.csv'].sort());
    expect(parseCsv(readFileSync(r.samplesPath, 'utf8'))).toEqual([['file', 'condition', 'dosage'], [item.fileName, item.condition, String(item.dosage)]]);
    const project = JSON.parse(readFileSync(r.projectPath, 'utf8'));
    expect(project.files[item.fileName].landmarks[0].name).toBe('furrow');
    // Source: OME-TIFF specification — PhysicalSizeX in the OME-XML is where the pixel size comes from
    const info = await readStackInfo(memoryByteSource(readFileSync(r.files[0])), item.fileName);
    expect([info.isOme, info.sizeC, info.sizeZ, info.pixelSize.source, info.compression]).toEqual([true, 2, item.params.sizeZ, 'ome', 'Deflate']);
  });
});

describe('the demo movie', () => {
  it('holds its time points and their spacing in the OME-XML (a 3-frame variant, to keep the test short)', async () => {
    expect([DEMO_MOVIE_PARAMS.frames, DEMO_MOVIE_PARAMS.frameIntervalS]).toEqual([46, 240]);
    const bytes = demoMovieFile({ ...DEMO_MOVIE_PARAMS, frames: 3 });
    // Source: OME-TIFF specification — Pixels SizeT and TimeIncrement (unit s) in the OME-XML.
    const info = await readStackInfo(memoryByteSource(bytes), DEMO_MOVIE_FILE);
    expect([info.sizeT, info.sizeC, info.sizeZ, info.time?.source]).toEqual([3, 2, 2, 'ome-increment']);
    expect(Array.from(info.time!.timesS!)).toEqual([0, 240, 480]);
  });
});
