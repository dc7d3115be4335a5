/**
 * `trestle suggest <input> --out <dir> [--by member|group] [--target <ratio>]
 *   [--max-depth <d>] [--keep-width] [--repeat]`: analyses the model, checks it, and writes
 * suggestions.csv — per member (or per group) the lightest section of its family that passes
 * every check with those forces (shared/design/suggest). `--max-depth` is in the model's
 * section-dimension unit (mm, or in for US models). `--repeat` analyses again with the
 * proposals applied until nothing changes (at most 10 passes) and reports the passes.
 * Exit codes as the other commands (run.ts).
 */
import { mkdir, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { InstabilityError } from '../../shared/engine/types.js';
import { toCsv } from '../../shared/exports/index.js';
import { formatProblem } from '../../shared/reader/index.js';
import { analyseModel } from '../../shared/stability/index.js';
import { iterateSuggestions, suggestSections, suggestionsTable, type SuggestBy, type SuggestLimits, type SuggestResult } from '../../shared/design/suggest/index.js';
import { toSI } from '../../shared/units/index.js';
import { readModelInput } from './input.js';

interface IO { out(line: string): void; err(line: string): void }

export const SUGGEST_USAGE = '       trestle suggest <input> --out <dir> [--by member|group] [--target <ratio>] [--max-depth <d>] [--keep-width] [--repeat]';

const CAUTION = 'Results are for checking by a competent engineer; local codes, national annexes and licensed practice govern.';

interface Args { input: string; out: string; by: SuggestBy; target?: number; maxDepth?: number; keepWidth: boolean; repeat: boolean }

function parse(args: string[]): Args | string {
  let input: string | undefined;
  let out: string | undefined;
  const a: Omit<Args, 'input' | 'out'> = { by: 'member', keepWidth: false, repeat: false };
  for (let i = 0; i < args.length; i++) {
    const [flag, inline] = args[i].startsWith('--') && args[i].includes('=') ? [args[i].slice(0, args[i].indexOf('=')), args[i].slice(args[i].indexOf('=') + 1)] : [args[i], undefined];
    const value = () => inline ?? args[++i];
    if (flag === '--out') out = value();
    else if (flag === '--by') {
      const v = value();
      if (v !== 'member' && v !== 'group') return `--by: give member or group (got "${v ?? ''}")`;
      a.by = v;
    } else if (flag === '--target') {
      const v = Number(value());
      if (!(v > 0 && v <= 1)) return '--target: give a ratio above 0 and at most 1';
      a.target = v;
    } else if (flag === '--max-depth') {
      const v = Number(value());
      if (!(v > 0 && Number.isFinite(v))) return '--max-depth: give a positive depth';
      a.maxDepth = v;
    } else if (flag === '--keep-width') a.keepWidth = true;
    else if (flag === '--repeat') a.repeat = true;
    else if (flag.startsWith('--')) return `unknown option ${flag}`;
    else if (input === undefined) input = flag;
    else return `unexpected argument ${flag}`;
  }
  if (!input) return 'no input given';
  if (!out) return 'no --out folder given';
  return { input, out, ...a };
}

export async function runSuggestCli(args: string[], io: IO): Promise<number> {
  const parsed = parse(args);
  if (typeof parsed === 'string') {
    io.err(`trestle suggest: ${parsed}`);
    io.err(SUGGEST_USAGE.trim());
    return 1;
  }
  const read = await readModelInput(parsed.input);
  if (!read.ok) {
    for (const p of read.problems) io.err(formatProblem(p));
    const n = read.problems.filter((p) => p.severity === 'error').length;
    io.err(`${n} problem${n === 1 ? '' : 's'} in ${parsed.input}: nothing written`);
    return 1;
  }
  for (const w of read.warnings) io.err(formatProblem(w));
  const model = read.model;
  if (model.settings.designCode === 'none') {
    io.err('settings design_code: none — sections can only be proposed against a design code; nothing written');
    return 1;
  }
  const limits: SuggestLimits = {
    ...(parsed.target !== undefined ? { targetRatio: parsed.target } : {}),
    ...(parsed.maxDepth !== undefined ? { maxDepth: toSI(parsed.maxDepth, 'section_dim', model.settings.units) } : {}),
    ...(parsed.keepWidth ? { keepWidth: true } : {}),
  };
  let result: SuggestResult;
  let passes = '';
  try {
    if (parsed.repeat) {
      const it = iterateSuggestions(model, { by: parsed.by, limits });
      result = it.result;
      passes = `; ${it.iterations} analysis pass${it.iterations === 1 ? '' : 'es'}, ${it.converged ? 'stable' : 'still changing at the cap (not converged)'}`;
    } else {
      const { analysis, stability, model: analysed } = analyseModel(model);
      result = suggestSections(analysed, analysis, { by: parsed.by, limits, stability });
    }
  } catch (e) {
    if (e instanceof InstabilityError || (e as Error)?.name === 'InstabilityError' || (e as Error)?.name === 'SecondOrderInstabilityError') {
      io.err(`unstable model: ${(e as Error).message}; nothing written`);
      return 2;
    }
    io.err(`the suggestions could not be made: ${(e as Error)?.message ?? String(e)}; nothing written`);
    return 3;
  }
  const text = toCsv(suggestionsTable(result));
  await mkdir(parsed.out, { recursive: true });
  await writeFile(join(parsed.out, 'suggestions.csv'), text, 'utf8');
  const t = result.totals;
  io.out(`${model.settings.title}: ${result.proposals.length} row${result.proposals.length === 1 ? '' : 's'} (by ${parsed.by}), ${t.changes} change${t.changes === 1 ? '' : 's'} proposed (${t.members} member${t.members === 1 ? '' : 's'}), mass change ${t.massChange.toFixed(0)} kg of ${t.massBefore.toFixed(0)} kg${passes}`);
  for (const n of result.notes) io.out(`note: ${n}`);
  io.out(CAUTION);
  io.out(`wrote suggestions.csv to ${parsed.out}`);
  return 0;
}
