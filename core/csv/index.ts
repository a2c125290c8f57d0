// Public surface of core/csv: RFC 4180 reading and writing (tables, sample sheets). Pure; depends on nothing else.
export { csvCell, csvRow, toCsv, type CsvValue } from './csv-write';
export { parseCsv, parseCsvRecords, CsvError } from './csv-parse';
