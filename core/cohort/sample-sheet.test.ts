import { describe, expect, it } from 'vitest';
import { CohortError } from './cohort-error';
import { parseSampleSheet } from './sample-sheet';
import { sheetFromFilenameRule } from './filename-rule';

describe('parseSampleSheet', () => {
  it('reads file, condition, dosage and free columns (header case-insensitive)', () => {
    // Source: demo data
    const s = parseSampleSheet('File,Condition,Dosage,stage\na.tif,ref,1,14\nb.tif,double,2,\n\n', 'samples.csv');
    expect(s.rows).toEqual([
      { file: 'a.tif', condition: 'ref', dosage: 1, extra: { stage: '14' }, line: 2 },
      { file: 'b.tif', condition: 'double', dosage: 2, extra: { stage: '' }, line: 3 },
    ]);
  });
  it('dosage column is optional', () => {
    // Source: demo data
    expect(parseSampleSheet('file,condition\na.tif,x\n', 's.csv').rows[0].dosage).toBeNull();
  });
  it('rejects bad sheets with exact one-line messages naming the file', () => {
    // Source: demo data
    const cases: [string, string][] = [
      ['', 's.csv: the sample sheet is empty'],
      ['file,group\na,b\n', 's.csv: missing column "condition" (the header needs file, condition; dosage is optional)'],
      ['file,condition\n', 's.csv: the sample sheet has a header but no rows'],
      ['file,condition,dosage\na.tif,x,abc\n', 's.csv line 2: dosage "abc" is not a positive number'],
      ['file,condition,dosage\na.tif,x,-1\n', 's.csv line 2: dosage "-1" is not a positive number'],
      ['file,condition\n,x\n', 's.csv line 2: empty file name'],
      ['file,condition\na.tif,\n', 's.csv line 2: empty condition for a.tif'],
    ];
    for (const [text, message] of cases) {
      expect(() => parseSampleSheet(text, 's.csv')).toThrow(new CohortError(message));
    }
  });
});

describe('sheetFromFilenameRule', () => {
  it('takes the condition (and dosage) from named groups; unmatched files are warnings', () => {
    // Source: demo data
    const r = sheetFromFilenameRule(['x2_e1.tif', 'x0p5_e2.tif', 'notes.tif'], { pattern: '^x(?<condition>(?<dosage>[0-9p]+))_' });
    expect(r.sheet.rows.map((x) => [x.file, x.condition, x.dosage])).toEqual([['x2_e1.tif', '2', 2], ['x0p5_e2.tif', '0p5', 0.5]]);
    expect(r.warnings).toEqual(['notes.tif: file name does not match the rule ^x(?<condition>(?<dosage>[0-9p]+))_; left out']);
  });
  it('maps conditions to dosages when the pattern has no dosage group', () => {
    // Source: demo data
    const r = sheetFromFilenameRule(['wt-1.tif', 'hi-1.tif'], { pattern: /^(?<condition>[a-z]+)-/, dosages: { wt: 1, hi: 4 } });
    expect(r.sheet.rows.map((x) => x.dosage)).toEqual([1, 4]);
  });
  it('rejects a pattern without a condition group', () => {
    // Source: demo data
    expect(() => sheetFromFilenameRule([], { pattern: '(.*)' })).toThrow('file-name rule: the pattern needs a named group (?<condition>...)');
    expect(() => sheetFromFilenameRule([], { pattern: '(?<condition>' })).toThrow(/^file-name rule: invalid regular expression/);
  });
});
