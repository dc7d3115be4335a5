/** What the batch-command tests share: a folder of CSV tables, a fresh output folder, and the command run in-process. */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../../server/cli/run.js';

/** A temporary folder holding `<table>.csv` for each table given. */
export function folder(tables: Record<string, string>): string {
  const dir = mkdtempSync(join(tmpdir(), 'trestle-in-'));
  for (const [name, text] of Object.entries(tables)) writeFileSync(join(dir, `${name}.csv`), text);
  return dir;
}

/** A path inside a new temporary folder, for `--out`. */
export function outDir(name = 'results'): string {
  return join(mkdtempSync(join(tmpdir(), 'trestle-out-')), name);
}

/** Runs `trestle <args>` in this process, collecting what it prints. */
export async function run(args: string[]): Promise<{ code: number; out: string[]; err: string[] }> {
  const out: string[] = [];
  const err: string[] = [];
  const code = await runCli(args, { out: (l) => out.push(l), err: (l) => err.push(l) });
  return { code, out, err };
}
