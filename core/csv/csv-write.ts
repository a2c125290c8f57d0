// CSV writing per RFC 4180: comma separator, CRLF line ends, fields quoted only when needed.

/** A value that may appear in one CSV cell; null, undefined and non-finite numbers become an empty cell. */
export type CsvValue = string | number | boolean | null | undefined;

const NEEDS_QUOTES = /[",\r\n]/;

/** One CSV field: quoted (with doubled quotes) when it holds a comma, quote, CR or LF; numbers use '.' decimals. */
export function csvCell(value: CsvValue): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  const text = typeof value === 'boolean' ? String(value) : value;
  return NEEDS_QUOTES.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** One CSV record (no line end). */
export function csvRow(values: readonly CsvValue[]): string {
  return values.map(csvCell).join(',');
}

/** A whole CSV document: header then rows, every record ended by CRLF. Rows must match the header's length. */
export function toCsv(header: readonly string[], rows: readonly (readonly CsvValue[])[]): string {
  const lines = [csvRow(header)];
  for (const row of rows) {
    if (row.length !== header.length) {
      throw new Error(`CSV row has ${row.length} cells but the header has ${header.length}`);
    }
    lines.push(csvRow(row));
  }
  return lines.map((line) => `${line}\r\n`).join('');
}
