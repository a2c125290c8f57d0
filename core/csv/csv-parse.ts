// CSV reading per RFC 4180 (also accepts bare LF line ends and a UTF-8 byte-order mark), for sample sheets.

/** Thrown for malformed CSV; the message is one line and says where. */
export class CsvError extends Error {
  override name = 'CsvError';
}

/** Parse CSV text into records of fields; empty lines are skipped; quoted fields may hold commas, quotes and line breaks. */
export function parseCsv(text: string): string[][] {
  const src = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const records: string[][] = [];
  let record: string[] = [];
  let field = '';
  let quoted = false;
  let line = 1;
  let quoteLine = 0;
  for (let i = 0; i < src.length; i += 1) {
    const ch = src[i];
    if (quoted) {
      if (ch === '"' && src[i + 1] === '"') { field += '"'; i += 1; }
      else if (ch === '"') quoted = false;
      else { if (ch === '\n') line += 1; field += ch; }
    } else if (ch === '"' && field === '') { quoted = true; quoteLine = line; }
    else if (ch === ',') { record.push(field); field = ''; }
    else if (ch === '\n' || ch === '\r') {
      if (ch === '\r' && src[i + 1] === '\n') i += 1;
      record.push(field);
      if (record.length > 1 || record[0] !== '') records.push(record);
      record = []; field = ''; line += 1;
    } else field += ch;
  }
  if (quoted) throw new CsvError(`unterminated quoted field starting on line ${quoteLine}`);
  record.push(field);
  if (record.length > 1 || record[0] !== '') records.push(record);
  return records;
}

/** Parse CSV with a header row into objects keyed by the (trimmed) header names; short rows get '' for missing cells. */
export function parseCsvRecords(text: string): Record<string, string>[] {
  const [header, ...rows] = parseCsv(text);
  if (header === undefined) return [];
  const names = header.map((h) => h.trim());
  return rows.map((row) => Object.fromEntries(names.map((name, i) => [name, row[i] ?? ''])));
}
