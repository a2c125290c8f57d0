import { describe, expect, it } from 'vitest';
import { csvCell, csvRow, toCsv } from './csv-write';
import { CsvError, parseCsv, parseCsvRecords } from './csv-parse';

describe('csvCell / csvRow (writing)', () => {
  it('quotes fields with commas, quotes and line breaks, doubling quotes', () => {
    // Source: RFC 4180 §2 rules 5–7 (fields with line breaks, double quotes, commas must be enclosed; quotes doubled)
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
    expect(csvCell('two\r\nlines')).toBe('"two\r\nlines"');
    expect(csvCell('plain')).toBe('plain');
  });
  it('writes null, undefined and non-finite numbers as empty cells and numbers with a dot', () => {
    // Source: product rule (empty cell for null, '.' decimal) — demo data
    expect(csvRow([null, undefined, Number.NaN, Number.POSITIVE_INFINITY, 0.25, -3, true])).toBe(',,,,0.25,-3,true');
  });
  it('ends every record with CRLF and rejects ragged rows', () => {
    // Source: RFC 4180 §2 rule 1 (records separated by CRLF)
    expect(toCsv(['a', 'b'], [[1, 'x y']])).toBe('a,b\r\n1,x y\r\n');
    expect(() => toCsv(['a', 'b'], [[1]])).toThrow('CSV row has 1 cells but the header has 2');
  });
});

describe('parseCsv (reading)', () => {
  it('reads the RFC 4180 examples', () => {
    // Source: RFC 4180 §2 examples for rules 1, 2, 5, 6 and 7
    expect(parseCsv('aaa,bbb,ccc\r\nzzz,yyy,xxx\r\n')).toEqual([['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]);
    expect(parseCsv('aaa,bbb,ccc\r\nzzz,yyy,xxx')).toEqual([['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]);
    expect(parseCsv('"aaa","bbb","ccc"\r\nzzz,yyy,xxx')).toEqual([['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]);
    expect(parseCsv('"aaa","b\r\nbb","ccc"\r\nzzz,yyy,xxx')).toEqual([['aaa', 'b\r\nbb', 'ccc'], ['zzz', 'yyy', 'xxx']]);
    expect(parseCsv('"aaa","b""bb","ccc"')).toEqual([['aaa', 'b"bb', 'ccc']]);
  });
  it('accepts LF line ends, a byte-order mark, empty fields and skips blank lines', () => {
    // Source: common practice (spreadsheets write a BOM; Unix tools write LF) — demo data
    expect(parseCsv('\ufeffa,b\n\n1,\n,2\n')).toEqual([['a', 'b'], ['1', ''], ['', '2']]);
  });
  it('round-trips what toCsv writes', () => {
    // Source: demo data
    const rows = [['x,1', 'he said "no"', 'multi\nline'], ['', 'plain', '3.5']];
    expect(parseCsv(toCsv(['a', 'b', 'c'], rows))).toEqual([['a', 'b', 'c'], ...rows]);
  });
  it('reports an unterminated quote with its line', () => {
    // Source: demo data
    expect(() => parseCsv('a,b\n1,"open\n2,3')).toThrow(CsvError);
    expect(() => parseCsv('a,b\n1,"open\n2,3')).toThrow('unterminated quoted field starting on line 2');
  });
  it('parseCsvRecords keys rows by trimmed header names', () => {
    // Source: demo data
    expect(parseCsvRecords('file, condition ,dosage\nE01.ome.tif,wt,1\nE02.ome.tif,half\n')).toEqual([
      { file: 'E01.ome.tif', condition: 'wt', dosage: '1' },
      { file: 'E02.ome.tif', condition: 'half', dosage: '' },
    ]);
  });
});
