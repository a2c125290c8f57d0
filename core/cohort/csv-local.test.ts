import { describe, expect, it } from 'vitest';
import { csvCell, parseCsvRows, toCsv } from './csv-local';

describe('CSV reading and writing', () => {
  it('parses quoted fields with commas, doubled quotes and line breaks', () => {
    // Source: RFC 4180 §2 rules 5–7 (quoted fields, embedded CRLF, "" for a quote)
    const text = 'a,"b,c","he said ""hi"""\r\n"x\r\ny",2,3\r\n';
    expect(parseCsvRows(text)).toEqual([['a', 'b,c', 'he said "hi"'], ['x\r\ny', '2', '3']]);
  });
  it('drops a leading byte-order mark and accepts a last line without a line break', () => {
    // Source: demo data
    expect(parseCsvRows('\ufefffile,condition\nA.tif,wt')).toEqual([['file', 'condition'], ['A.tif', 'wt']]);
  });
  it('quotes only when needed and writes null / NaN as empty cells', () => {
    // Source: RFC 4180 §2 rule 6
    expect(csvCell('plain')).toBe('plain');
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell('say "x"')).toBe('"say ""x"""');
    expect(csvCell(null)).toBe('');
    expect(csvCell(NaN)).toBe('');
    expect(csvCell(0.123456789012)).toBe('0.12345679');
    expect(toCsv(['a', 'b'], [[1, 'x'], [null, 2.5]])).toBe('a,b\n1,x\n,2.5\n');
  });
});
