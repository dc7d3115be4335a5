/** The model reader: raw tables → validated model (pure), and the CSV / XLSX row sources. */
export { readTables, type ReadOptions } from './read.js';
export type { RawTable, Cell } from './table.js';
export { formatProblem } from './problems.js';
export { lanePath, type LanePath, type LaneStep } from './lanes.js';
export { readCsvFiles, readCsvBytes, csvTable, tableNameOfFile, type CsvFile, type CsvBytes } from './csv.js';
export { readWorkbook, workbookTables, XlsxLimitError, type XlsxLimits } from './xlsx.js';
