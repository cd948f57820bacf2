/** Intake formats: bill CSVs, Green Button (ESPI) feeds and NCEI daily weather, parsed and checked row by row. */
export * from './problems';
export * from './bill-csv-mapping';
export * from './bill-csv-suggest';
export * from './bill-csv-row';
export * from './bill-csv-stream';
export { parseDateCell, DEFAULT_TWO_DIGIT_YEAR_PIVOT, type DateCellResult } from './cell-date';
export { parseNumberCell, type DecimalMark, type NumberCellResult } from './cell-number';
export { detectDelimiter, detectNewline, type CsvDelimiter, type CsvNewline } from './csv-dialect';
export { CsvRecordReader, readCsvInput, DEFAULT_MAX_BYTES, type CsvInput, type CsvDialect, type CsvRecordHandler } from './csv-records';
export { sniffBytes, sniffText } from './file-sniff';
export * from './green-button';
export * from './weather-day';
export * from './weather-csv';
export * from './weather-json';
