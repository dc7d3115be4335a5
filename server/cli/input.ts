/** Loads the batch command's input: an `.xlsx` workbook or a folder of `<table>.csv` files. */
import { readdir, readFile, stat } from 'node:fs/promises';
import { basename, extname, join } from 'node:path';
import type { ReadResult } from '../../shared/model/types.js';
import { readCsvFiles, readWorkbook } from '../../shared/reader/index.js';

export async function readModelInput(input: string): Promise<ReadResult> {
  const fail = (message: string): ReadResult => ({ ok: false, problems: [{ severity: 'error', table: '', message }], counts: {} });
  let info;
  try {
    info = await stat(input);
  } catch {
    return fail(`input ${input} does not exist`);
  }
  if (info.isDirectory()) {
    const names = (await readdir(input)).filter((n) => extname(n).toLowerCase() === '.csv').sort();
    if (names.length === 0) return fail(`folder ${input} holds no .csv files`);
    const files = await Promise.all(names.map(async (name) => ({ name, text: await readFile(join(input, name), 'utf8') })));
    return readCsvFiles(files, { fileName: basename(input.replace(/[\\/]+$/, '')) });
  }
  if (extname(input).toLowerCase() === '.xlsx') {
    const bytes = await readFile(input);
    return readWorkbook(new Uint8Array(bytes.buffer, bytes.byteOffset, bytes.byteLength), { fileName: basename(input, extname(input)) });
  }
  if (extname(input).toLowerCase() === '.csv') return fail(`input ${input} is a single CSV file: give the folder that holds one <table>.csv per table`);
  return fail(`input ${input} is neither an .xlsx workbook nor a folder of .csv files`);
}
