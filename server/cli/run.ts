/**
 * The `trestle` batch command:
 *   trestle analyse <input> --out <dir>   displacements.csv, reactions.csv, member_forces.csv
 *                                         (and moving_extremes.csv with moving loads)
 *   trestle check <input> --out <dir>     the same plus utilisation.csv and checks.csv
 *   trestle suggest <input> --out <dir>   suggestions.csv: lightest passing sections (suggest.ts)
 * Both add stability.csv (elastic critical load factors) when `buckling_modes` > 0 or αcr were
 * computed for the first-order stability warning, and modes.csv when `modes` > 0. The
 * analysis is the one the settings ask for (`analysis` = first_order | second_order).
 * Exit codes: 0 success; 1 invalid input or usage (each problem printed as
 * `table row column: message`); 2 unstable model (node and freedom printed) or, second order,
 * a loading at or above its critical load (loading and αcr printed); 3 the
 * analysis or the checks could not run for another reason. Nothing is written unless
 * every file could be produced.
 */
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { AnalysisResult } from '../../shared/engine/types.js';
import { InstabilityError } from '../../shared/engine/types.js';
import {
  checksTable, displacementTable, memberForceTable, movingExtremesTable, reactionTable, toCsv, utilisationTable, type DesignResultLike, type ResultTable,
} from '../../shared/exports/index.js';
import type { Model } from '../../shared/model/types.js';
import { formatProblem } from '../../shared/reader/index.js';
import type { StabilitySummary } from '../../shared/stability/types.js';
import { stabilityToJson } from '../runs/stability-codec.js';
import { stabilityTables } from '../runs/stability-tables.js';
import { readModelInput } from './input.js';
import { runSuggestCli, SUGGEST_USAGE } from './suggest.js';

export interface CliIO {
  out(line: string): void;
  err(line: string): void;
}

export const EXIT = { ok: 0, invalid: 1, unstable: 2, failed: 3 } as const;

const USAGE = [
  'usage: trestle analyse <input> --out <dir>',
  '       trestle check <input> --out <dir>',
  SUGGEST_USAGE,
  '<input> is an .xlsx workbook or a folder of <table>.csv files',
];

/** checkModel; the stability option is read by checks that take it (DesignOptions.stability). */
type Checker = (model: Model, analysis: AnalysisResult, options?: { stability?: StabilitySummary }) => DesignResultLike;

/** The design checks, when the design module exists. */
async function loadChecker(): Promise<Checker | string> {
  try {
    const mod = (await import('../../shared/design/index.js' as string)) as { checkModel?: Checker };
    if (typeof mod.checkModel !== 'function') return 'the design checks are not available in this build (shared/design/index.ts exports no checkModel)';
    return mod.checkModel;
  } catch (e) {
    return `the design checks are not available in this build (${(e as Error).message.split('\n')[0]})`;
  }
}

function parseArgs(args: string[]): { command: string; input: string; out: string } | string {
  const [command, ...rest] = args;
  if (command !== 'analyse' && command !== 'check') return command ? `unknown command "${command}"` : 'no command given';
  let input: string | undefined;
  let out: string | undefined;
  for (let i = 0; i < rest.length; i++) {
    if (rest[i] === '--out') out = rest[++i];
    else if (rest[i].startsWith('--out=')) out = rest[i].slice(6);
    else if (rest[i].startsWith('--')) return `unknown option ${rest[i]}`;
    else if (input === undefined) input = rest[i];
    else return `unexpected argument ${rest[i]}`;
  }
  if (!input) return 'no input given';
  if (!out) return 'no --out folder given';
  return { command, input, out };
}

/** "; lowest αcr 8.31 (ULS-2); first frequency 2.41 Hz" — what the stability floor found. */
function stabilityLine(s: ReturnType<typeof stabilityToJson>): string {
  const parts: string[] = [];
  const iterations = s.secondOrder.map((l) => l.iterations);
  if (iterations.length) parts.push(`${iterations.length} loading${iterations.length === 1 ? '' : 's'} to second order, up to ${Math.max(...iterations)} iterations`);
  let lowest: { loading: string; a: number } | null = null;
  for (const c of s.critical) {
    const a = c.alphaCr[0];
    if (a !== null && a !== undefined && (!lowest || a < lowest.a)) lowest = { loading: c.loading, a };
  }
  if (lowest) parts.push(`lowest αcr ${lowest.a.toPrecision(4)} (${lowest.loading})`);
  if (s.modes.length) parts.push(`first natural frequency ${s.modes[0].frequency.toPrecision(4)} Hz`);
  return parts.length ? `; ${parts.join('; ')}` : '';
}

export async function runCli(args: string[], io: CliIO): Promise<number> {
  try {
    if (args[0] === 'suggest') return await runSuggestCli(args.slice(1), io);
    const parsed = parseArgs(args);
    if (typeof parsed === 'string') {
      io.err(`trestle: ${parsed}`);
      USAGE.forEach((l) => io.err(l));
      return EXIT.invalid;
    }
    const { command, input, out } = parsed;
    let checker: Checker | undefined;
    if (command === 'check') {
      const c = await loadChecker();
      if (typeof c === 'string') {
        io.err(`trestle check: ${c}; use trestle analyse for the analysis results`);
        return EXIT.failed;
      }
      checker = c;
    }
    const read = await readModelInput(input);
    if (!read.ok) {
      for (const p of read.problems) io.err(formatProblem(p));
      const n = read.problems.filter((p) => p.severity === 'error').length;
      io.err(`${n} problem${n === 1 ? '' : 's'} in ${input}: nothing written`);
      return EXIT.invalid;
    }
    for (const w of read.warnings) io.err(formatProblem(w));
    const inputModel = read.model;

    let analysis: AnalysisResult;
    let stability: StabilitySummary;
    /** the model the analysis ran on (second order under a code adds cases and combination variants) */
    let model: Model;
    let notes: string[];
    try {
      const { analyseModel } = await import('../../shared/stability/index.js');
      ({ analysis, stability, model, notes } = analyseModel(inputModel));
    } catch (e) {
      if (e instanceof InstabilityError || (e as Error)?.name === 'InstabilityError') {
        const ie = e as InstabilityError;
        io.err(`unstable model: ${ie.message}`);
        io.err(`node ${ie.node} freedom ${ie.freedom}`);
        io.err('nothing written');
        return EXIT.unstable;
      }
      if ((e as Error)?.name === 'SecondOrderInstabilityError') {
        // a loading at or above its critical load (second order): named with its αcr
        io.err(`unstable at this load level: ${(e as Error).message}`);
        io.err('nothing written');
        return EXIT.unstable;
      }
      io.err(`the analysis failed: ${(e as Error)?.message ?? String(e)}; nothing written`);
      return EXIT.failed;
    }

    const tables: ResultTable[] = [displacementTable(model, analysis), reactionTable(model, analysis), memberForceTable(model, analysis)];
    const extremes = movingExtremesTable(model, analysis);
    if (extremes) tables.push(extremes);
    const stabilityJson = stabilityToJson(stability, notes);
    const stabilityFiles = stabilityTables(stabilityJson, model.settings);
    if (checker) {
      if (model.settings.designCode === 'none') io.err('settings design_code: warning: design_code is none, so every member comes out not checked');
      let design: DesignResultLike;
      try {
        design = checker(model, analysis, { stability });
      } catch (e) {
        io.err(`the design checks failed: ${(e as Error)?.message ?? String(e)}; nothing written`);
        return EXIT.failed;
      }
      tables.push(utilisationTable(model, design), checksTable(model, design));
      const fails = design.members.filter((m) => m.status === 'fail').length;
      const notChecked = design.members.filter((m) => m.status === 'not checked').length;
      io.out(`${design.members.length} members checked to ${model.settings.designCode}: ${fails} fail, ${notChecked} not checked`);
    }
    tables.push(...stabilityFiles);
    const texts = tables.map((t) => ({ file: `${t.name}.csv`, text: toCsv(t) }));
    await mkdir(out, { recursive: true });
    for (const t of texts) await writeFile(join(out, t.file), t.text, 'utf8');
    io.out(`${model.settings.title}: ${model.nodes.length} nodes, ${model.members.length} members, ${analysis.loadings.length} loadings`);
    if (analysis.moving) {
      // moving loads (issue 7): say what crossed which lane, and how often it stopped
      const d = analysis.moving.diagnostics;
      const lanes = analysis.moving.lanes.map((l) => `${l.lane} (${l.length.toPrecision(6)} m)`).join(', ');
      io.out(`moving loads: ${model.movingLoads.map((ml) => `${ml.vehicle} on ${ml.lane}`).join(', ')}; lanes ${lanes}; ${d.positions} vehicle positions, ${d.milliseconds.toFixed(0)} ms; envelope loadings in rows marked max/min`);
    }
    io.out(`analysis: ${stability.method}${stabilityLine(stabilityJson)}`);
    for (const n of notes) io.out(`note: ${n}`);
    for (const w of stabilityJson.warnings) io.err(`stability warning: ${w.message}`);
    io.out(`wrote ${texts.map((t) => t.file).join(', ')} to ${out}`);
    return EXIT.ok;
  } catch (e) {
    io.err(`trestle: ${(e as Error)?.message ?? String(e)}`);
    return EXIT.failed;
  }
}
