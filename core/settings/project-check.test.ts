// Project files: version 2 (per-time-point edits) and the migration of version 1. All inputs are demo data.
import { describe, expect, it } from 'vitest';
import { DEFAULT_SETTINGS } from './defaults';
import { parseProjectText, PROJECT_VERSION } from './project-check';
import { fileEditsAt } from './time-point-edits';

const axis = { anterior: { x: 10, y: 50 }, posterior: { x: 190, y: 52 }, source: 'hand' };
const v1 = {
  schema: 'eggline-project', version: 1, folder: '.', settings: { projection: 'max' },
  files: { 'a.tif': { axis, landmarks: [{ name: 'furrow', point: { x: 80, y: 40 } }], fitRangeEl: [0.2, 0.5] }, 'b.tif': { axis: null, landmarks: [] } },
};

describe('project file versions', () => {
  it('reads a version 1 file as version 2 with the same edits, which then hold at every time point', () => {
    const doc = parseProjectText(JSON.stringify(v1), 'old.json');
    expect(PROJECT_VERSION).toBe(2);
    expect(doc.version).toBe(2);
    expect(doc.settings).toEqual({ ...DEFAULT_SETTINGS, projection: 'max' });
    expect(doc.files['a.tif']).toEqual({ axis, landmarks: [{ name: 'furrow', point: { x: 80, y: 40 } }], fitRangeEl: [0.2, 0.5] });
    expect(doc.files['b.tif']).toEqual({ axis: null, landmarks: [], fitRangeEl: null });
    expect(fileEditsAt(doc.files['a.tif'], 7)).toEqual(doc.files['a.tif']);
    // Written again, it reads back the same (the migration is stable).
    expect(parseProjectText(JSON.stringify(doc), 'new.json')).toEqual(doc);
  });

  it('reads per-time-point edits in version 2; a time point\'s fields replace the file\'s there only', () => {
    const other = { anterior: { x: 12, y: 60 }, posterior: { x: 188, y: 58 }, source: 'hand' };
    const doc = parseProjectText(JSON.stringify({
      ...v1, version: 2, files: { 'movie.tif': { ...v1.files['a.tif'], timePoints: { 3: { axis: other }, 10: { fitRangeEl: null, landmarks: [] } } } },
    }), 'p.json');
    const edits = doc.files['movie.tif'];
    expect(Object.keys(edits.timePoints ?? {})).toEqual(['3', '10']);
    expect(fileEditsAt(edits, 0)).toEqual({ axis, landmarks: v1.files['a.tif'].landmarks, fitRangeEl: [0.2, 0.5] });
    expect(fileEditsAt(edits, 3)).toEqual({ axis: other, landmarks: v1.files['a.tif'].landmarks, fitRangeEl: [0.2, 0.5] });
    expect(fileEditsAt(edits, 10)).toEqual({ axis, landmarks: [], fitRangeEl: null });
    expect(fileEditsAt(edits, null)).toEqual(fileEditsAt(edits, 0));
    expect(fileEditsAt(null, 3)).toBeNull();
    expect(parseProjectText(JSON.stringify(doc), 'p.json')).toEqual(doc);
  });

  it('ignores timePoints in a version 1 file (that version has none) and refuses bad ones in version 2 with one line', () => {
    const withTimes = { ...v1, files: { 'a.tif': { ...v1.files['a.tif'], timePoints: { 1: { axis: null } } } } };
    expect(parseProjectText(JSON.stringify(withTimes), 'p.json').files['a.tif'].timePoints).toBeUndefined();
    const bad = (timePoints: unknown) => () => parseProjectText(JSON.stringify({ ...v1, version: 2, files: { 'a.tif': { axis: null, landmarks: [], timePoints } } }), 'p.json');
    expect(bad({ '-1': {} })).toThrow('p.json: files["a.tif"].timePoints has the key "-1"; keys must be time points (0-based whole numbers: "0", "1", …)');
    expect(bad({ '01': {} })).toThrow(/keys must be time points/);
    expect(bad([])).toThrow(/files\["a\.tif"\]\.timePoints must be an object keyed by time point/);
    expect(bad({ 2: { fitRangeEl: [0.6, 0.2] } })).toThrow(/^p\.json: files\["a\.tif"\]\.timePoints\["2"\]\.fitRangeEl must be/);
    expect(() => parseProjectText(JSON.stringify({ ...v1, version: 3 }), 'p.json')).toThrow(/version is 3, newer than this Eggline reads \(2\)/);
  });

  it('reads a movie\'s own time points and time step, in the --time and --time-step flags\' text and wording', () => {
    const doc = (file: unknown) => parseProjectText(JSON.stringify({ ...v1, version: 2, files: { 'm.tif': { axis: null, landmarks: [], ...(file as object) } } }), 'p.json');
    expect(doc({ time: ' 10:25 ', timeStepS: 30 }).files['m.tif']).toMatchObject({ time: '10:25', timeStepS: 30 });
    expect(doc({ time: 'all' }).files['m.tif'].time).toBe('all');
    expect(doc({ time: null, timeStepS: null }).files['m.tif']).toEqual({ axis: null, landmarks: [], fitRangeEl: null });
    expect(() => doc({ time: '9:3' })).toThrow('p.json: files["m.tif"].time must be all, a time point K or a range A:B (0-based, A ≤ B), got "9:3"');
    expect(() => doc({ time: 4 })).toThrow('p.json: files["m.tif"].time must be all, a time point K or a range A:B (0-based, A ≤ B)');
    expect(() => doc({ timeStepS: 0 })).toThrow('p.json: files["m.tif"].timeStepS must be a positive number of seconds (got "0")');
  });

  it('keeps the shared time point as saved, whatever the files hold: a file with fewer is analysed at its last, with a warning (timePointForFile)', () => {
    const doc = parseProjectText(JSON.stringify({ ...v1, version: 2, settings: { timeIndex: 5 } }), 'p.json');
    expect(doc.settings.timeIndex).toBe(5);
    expect(() => parseProjectText(JSON.stringify({ ...v1, version: 2, settings: { timeIndex: -1 } }), 'p.json')).toThrow(/timeIndex/);
  });
});
