import { describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS, parseProjectText, settingsInForce } from '../settings';
import { editsForFile, toHandEdits } from './project-edits';
import { isStackFileName, sortStackPaths } from './stack-files';

// Source: demo data; messages are this project's pinned wording.
const doc = {
  schema: 'eggline-project', version: 1, folder: '/data/run', settings: DEFAULT_SETTINGS,
  files: {
    'sub/E02.ome.tif': { axis: { anterior: { x: 1, y: 2 }, posterior: { x: 90, y: 3 }, source: 'auto' }, landmarks: [], fitRangeEl: [0.2, 0.5] },
    'E01.ome.tif': { axis: null, landmarks: [{ name: 'furrow', point: { x: 30, y: 4 } }], fitRangeEl: null },
  },
};

describe('project edits', () => {
  it('parses a project and finds edits by relative path (either slash)', () => {
    const p = parseProjectText(JSON.stringify(doc), 'p.json');
    expect(editsForFile(p, 'sub\\E02.ome.tif')?.fitRangeEl).toEqual([0.2, 0.5]);
    expect(editsForFile(p, 'missing.tif')).toBeNull();
    expect(editsForFile(null, 'E01.ome.tif')).toBeNull();
  });
  it('turns edits into hand edits (axis marked hand) and a per-file fit range', () => {
    const p = parseProjectText(JSON.stringify(doc), 'p.json');
    const e2 = editsForFile(p, 'sub/E02.ome.tif');
    expect(toHandEdits(e2)?.axis?.source).toBe('hand');
    expect(settingsInForce(DEFAULT_SETTINGS, e2).fitRangeEl).toEqual([0.2, 0.5]);
    const e1 = editsForFile(p, 'E01.ome.tif');
    expect(toHandEdits(e1)).toEqual({ axis: null, landmarks: [{ name: 'furrow', point: { x: 30, y: 4 } }] });
    expect(settingsInForce(DEFAULT_SETTINGS, e1)).toBe(DEFAULT_SETTINGS);
    expect(toHandEdits({ axis: null, landmarks: [], fitRangeEl: null })).toBeNull();
  });
  it('gives the edits in force at a time point: the time point\'s own over the file\'s (project version 2)', () => {
    const v2 = { ...doc, version: 2, files: { 'm.tif': { ...doc.files['E01.ome.tif'], timePoints: { 4: { fitRangeEl: [0.15, 0.45] } } } } };
    const p = parseProjectText(JSON.stringify(v2), 'p.json');
    expect(editsForFile(p, 'm.tif')?.fitRangeEl).toBeNull();
    expect(editsForFile(p, 'm.tif', undefined, 4)).toEqual({ ...doc.files['E01.ome.tif'], fitRangeEl: [0.15, 0.45] });
    expect(settingsInForce(DEFAULT_SETTINGS, editsForFile(p, 'm.tif', undefined, 4)).fitRangeEl).toEqual([0.15, 0.45]);
    expect(toHandEdits(editsForFile(p, 'm.tif', undefined, 4))?.landmarks).toHaveLength(1);
  });
  it('applies a per-file dorsal side to the profile settings, and checks it', () => {
    const flipped = { ...doc, files: { 'F.tif': { axis: null, landmarks: [], fitRangeEl: null, dorsalSide: 'right' } } };
    const e = editsForFile(parseProjectText(JSON.stringify(flipped), 'p.json'), 'F.tif');
    expect(e?.dorsalSide).toBe('right');
    const s = settingsInForce(DEFAULT_SETTINGS, e);
    expect(s.profile.dorsalSide).toBe('right');
    expect(s.profile.edgeSide).toBe(DEFAULT_SETTINGS.profile.edgeSide);
    expect(DEFAULT_SETTINGS.profile.dorsalSide).toBe('left');
    const bad = { ...doc, files: { 'F.tif': { axis: null, landmarks: [], fitRangeEl: null, dorsalSide: 'up' } } };
    expect(() => parseProjectText(JSON.stringify(bad), 'p.json')).toThrow('p.json: files["F.tif"].dorsalSide must be \'left\' or \'right\'');
  });
  it('pins the messages for bad project files', () => {
    expect(() => parseProjectText('{"schema":"other"}', 'p.json')).toThrow('p.json: schema must be \'eggline-project\' (found "other"); this is not an Eggline project');
    expect(() => parseProjectText('{"schema":"eggline-project","version":9,"files":{}}', 'p.json')).toThrow('p.json: version is 9, newer than this Eggline reads (2); update Eggline to open it');
    const badRange = { ...doc, files: { 'a.tif': { axis: null, landmarks: [], fitRangeEl: [0.9, 0.1] } } };
    expect(() => parseProjectText(JSON.stringify(badRange), 'p.json'))
      .toThrow('p.json: files["a.tif"].fitRangeEl must be two numbers [a, b] with 0 ≤ a < b ≤ 1');
  });
});

describe('stack file names', () => {
  it('accepts the TIFF family and skips others and hidden files', () => {
    // Source: OME-TIFF specification (file extensions .ome.tif/.ome.tiff/.ome.btf/.ome.tf8/.ome.tf2)
    for (const n of ['a.tif', 'b.TIFF', 'c.ome.tif', 'd.ome.tiff', 'e.btf', 'f.ome.tf8', 'g.tf2']) expect(isStackFileName(n)).toBe(true);
    for (const n of ['a.png', 'notes.txt', '._a.tif', 'tif', 'a.tif.bak']) expect(isStackFileName(n)).toBe(false);
  });
  it('sorts by code unit, not locale', () => {
    // Source: demo data
    expect(sortStackPaths(['b.tif', 'B.tif', 'a/z.tif', 'a.tif', 'E10.tif', 'E2.tif']))
      .toEqual(['B.tif', 'E10.tif', 'E2.tif', 'a.tif', 'a/z.tif', 'b.tif']);
  });
});
