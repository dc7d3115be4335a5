/** The model reader: raw tables → validated model (pure), and the CSV / XLSX row sources. */
export { readTables, type ReadOptions } from './read.js';
export type { RawTable, Cell } from './table.js';
export { formatProblem } from './problems.js';
export { lanePath, type LanePath, type LaneStep } from './lanes.js';
export { readCsvFiles, csvTable, tableNameOfFile, type CsvFile } from './csv.js';
export { readWorkbook, workbookTables } from './xlsx.js';
