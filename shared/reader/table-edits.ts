/**
 * The Model tab's tables (issue 13): a validated model as the tables the importer reads
 * (`workbook-writer.ts`), and edits of cases, node loads, member loads and combinations
 * applied to them and read again by the reader itself — the server before saving a version,
 * the client as the user types. One set of rules: the reader's.
 *
 * Rows are numbered from 1 in each table as the grid shows them; added rows take the next
 * numbers, so a problem's row is the row the user sees. Combinations are always shown in long
 * form with their source; generated ones (by the rule, or one per case) are read back only
 * when edited, and then `combination_rule` becomes `table` (the edited list is the table now).
 * Pure: no DOM, no file system.
 */
import type { Model, Problem } from '../model/types.js';
import type { EditableTable, ModelTable, ModelTableColumn, ModelTables, TableCell, TableEdit, TableProblem } from '../schemas/models.js';
import { EDITABLE_TABLES } from '../schemas/models.js';
import { splitHeader } from '../units/index.js';
import { canonicalName } from './names.js';
import { readTables } from './read.js';
import { COMBINATIONS_LONG, TABLES } from './specs.js';
import { parseTable, type Cell, type RawTable, type TableSpec } from './table.js';
import { Problems } from './problems.js';
import { modelTables, type WrittenTable } from './workbook-writer.js';

const SPECS: Record<string, TableSpec> = { ...TABLES, combinations: COMBINATIONS_LONG };

function columnsOf(t: WrittenTable, editable: boolean): ModelTableColumn[] {
  const spec = SPECS[t.name];
  return (t.rows[0] ?? []).map((h) => {
    const { name, unit } = splitHeader(String(h));
    const c = spec?.columns.find((x) => x.name === canonicalName(name));
    return {
      name, header: String(h), unit: unit || null, kind: c?.kind ?? 'text',
      ...(c?.values ? { values: [...c.values] } : {}), editable,
    };
  });
}

function cellOf(c: Cell): TableCell {
  if (c === undefined || c === null) return null;
  if (typeof c === 'boolean') return c ? 'yes' : 'no';
  return c;
}

/** Combinations in long form with their source (always a table on the Model tab). */
function combinationsTable(model: Model, written: WrittenTable | undefined): ModelTable {
  const generated = !written;
  const columns: ModelTableColumn[] = [
    { name: 'combination', header: 'combination', unit: null, kind: 'id', editable: true },
    { name: 'limit_state', header: 'limit_state', unit: null, kind: 'enum', values: ['strength', 'service'], editable: true },
    { name: 'case', header: 'case', unit: null, kind: 'id', editable: true },
    { name: 'factor', header: 'factor', unit: null, kind: 'number', editable: true },
    { name: 'source', header: 'source', unit: null, kind: 'text', editable: false },
  ];
  let row = 0;
  const rows = model.combinations.flatMap((c) =>
    c.terms.map((t) => ({ row: ++row, cells: [c.id, c.limitState, t.case, t.factor, c.source ?? (generated ? 'generated' : 'combinations table')] as TableCell[] })),
  );
  const rule = model.settings.combinationRule;
  const note = generated
    ? `Generated ${rule === 'table' ? 'one per case (no combinations table)' : `by the rule ${rule}`}; editing them makes this list the combinations table (combination_rule = table).`
    : undefined;
  return { name: 'combinations', editable: true, columns, rows, generated, ...(note ? { note } : {}) };
}

/** Every table of the model as the Model tab shows it, values in the model's unit system. */
export function modelTablesView(model: Model, modelId: number, version: number): ModelTables {
  const written = modelTables(model);
  const tables: ModelTable[] = [];
  for (const t of written) {
    if (t.name === 'combinations') continue;
    const editable = (EDITABLE_TABLES as readonly string[]).includes(t.name);
    tables.push({
      name: t.name, editable, columns: columnsOf(t, editable),
      rows: t.rows.slice(1).map((r, i) => ({ row: i + 1, cells: r.map(cellOf) })),
    });
    if (t.name === 'settlements') tables.push(combinationsTable(model, written.find((x) => x.name === 'combinations')));
  }
  const sections = tables.find((t) => t.name === 'sections');
  const catalogue = model.sections.filter((s) => s.builtIn).map((s) => s.id);
  if (sections && catalogue.length) sections.note = `Also used from the catalogue: ${catalogue.join(', ')}.`;
  return { modelId, version, units: model.settings.units, tables };
}

export interface AppliedEdits {
  /** the tables to read: the model's, with the edited ones changed */
  raw: RawTable[];
  /** edits that name a row or column that is not there */
  problems: TableProblem[];
  /** tables that some edit touched */
  edited: Set<EditableTable>;
}

/** Applies the edits to the shown tables and returns what the reader is to read. */
export function applyTableEdits(view: ModelTables, edits: readonly TableEdit[]): AppliedEdits {
  const problems: TableProblem[] = [];
  const edited = new Set<EditableTable>();
  const work = new Map(view.tables.map((t) => [t.name, { t, rows: t.rows.map((r) => ({ row: r.row, cells: r.cells.slice() })), next: t.rows.reduce((n, r) => Math.max(n, r.row), 0) + 1 }]));
  for (const e of edits) {
    const w = work.get(e.table);
    if (!w) { problems.push({ table: e.table, row: null, column: null, message: `table ${e.table} is not in this model` }); continue; }
    edited.add(e.table);
    const colIndex = (name: string) => w.t.columns.findIndex((c) => c.editable && canonicalName(c.name) === canonicalName(name));
    if (e.action === 'add') {
      const cells: TableCell[] = w.t.columns.map(() => null);
      for (const [k, v] of Object.entries(e.values)) {
        const i = colIndex(k);
        if (i < 0) problems.push({ table: e.table, row: w.next, column: k, message: `${e.table} has no column ${k} that can be edited` });
        else cells[i] = v;
      }
      w.rows.push({ row: w.next++, cells });
      continue;
    }
    const at = w.rows.findIndex((r) => r.row === e.row);
    if (at < 0) { problems.push({ table: e.table, row: e.row, column: null, message: `${e.table} has no row ${e.row}` }); continue; }
    if (e.action === 'delete') { w.rows.splice(at, 1); continue; }
    const i = colIndex(e.column);
    if (i < 0) { problems.push({ table: e.table, row: e.row, column: e.column, message: `${e.table} has no column ${e.column} that can be edited` }); continue; }
    w.rows[at].cells[i] = e.value;
  }
  const combos = work.get('combinations');
  const readCombos = combos && (!combos.t.generated || edited.has('combinations'));
  const raw: RawTable[] = [];
  for (const { t, rows } of work.values()) {
    if (t.name === 'combinations' && !readCombos) continue;
    const keep = t.columns.map((c, i) => (t.name === 'combinations' && !c.editable ? -1 : i)).filter((i) => i >= 0);
    let cells = rows.map((r) => keep.map((i) => r.cells[i] as Cell));
    if (t.name === 'settings' && readCombos && combos!.t.generated) {
      cells = cells.map((r) => (canonicalName(String(r[0])) === 'combination_rule' ? [r[0], 'table'] : r));
    }
    raw.push({
      name: t.name,
      rows: [keep.map((i) => t.columns[i].header), ...cells],
      rowNumbers: [0, ...rows.map((r) => r.row)],
      source: 'xlsx',
    });
  }
  return { raw, problems, edited };
}

/** The reader's errors as table problems (warnings are not refusals). */
export function tableProblems(list: readonly Problem[]): TableProblem[] {
  return list.filter((p) => p.severity === 'error').map((p) => ({ table: p.table, row: p.row ?? null, column: p.column ?? null, message: p.message }));
}

/** `member_loads row 3, w1: "abc" is not a number` */
export function describeTableProblem(p: TableProblem): string {
  const where = [p.table || 'model', p.row !== null ? `row ${p.row}` : ''].filter(Boolean).join(' ');
  return `${where}${p.column ? `, ${p.column}` : ''}: ${p.message}`;
}

export type TableEditOutcome =
  | { ok: true; model: Model; edited: Set<EditableTable>; counts: Record<string, number> }
  | { ok: false; problems: TableProblem[] };

/**
 * Edits applied to a model and read again with the reader's rules: the new model (cases,
 * loads and combinations from the reading, everything else as it was) or every problem.
 */
export function applyTableEditsToModel(model: Model, edits: readonly TableEdit[], modelId = 0, version = 0): TableEditOutcome {
  const applied = applyTableEdits(modelTablesView(model, modelId, version), edits);
  if (applied.problems.length) return { ok: false, problems: applied.problems };
  return readEdited(model, applied);
}

function readEdited(model: Model, applied: AppliedEdits): TableEditOutcome {
  const result = readTables(applied.raw, { fileName: model.settings.title });
  if (!result.ok) return { ok: false, problems: tableProblems(result.problems) };
  const read = result.model;
  return {
    ok: true,
    edited: applied.edited,
    counts: result.counts,
    model: {
      ...model,
      settings: { ...model.settings, combinationRule: read.settings.combinationRule },
      cases: read.cases,
      nodeLoads: read.nodeLoads,
      memberLoads: read.memberLoads,
      combinations: read.combinations,
    },
  };
}

/** Client side: check pending edits against the shown tables with the reader (no model at hand). */
export function checkTableEdits(view: ModelTables, edits: readonly TableEdit[]): TableProblem[] {
  if (edits.length === 0) return [];
  const applied = applyTableEdits(view, edits);
  if (applied.problems.length) return applied.problems;
  const result = readTables(applied.raw, {});
  return result.ok ? [] : tableProblems(result.problems);
}

/**
 * One cell as the user types it, checked by the reader's own cell rules for that column
 * (number, bounds, one of the allowed words, id rules); null when it reads, else the message.
 * Ids that must exist elsewhere (a case, a node) are checked on the whole tables
 * (`checkTableEdits`).
 */
export function checkCell(table: string, column: ModelTableColumn, value: TableCell, units: Model['settings']['units']): string | null {
  const spec = SPECS[table];
  if (!spec) return null;
  const problems = new Problems();
  const raw: RawTable = { name: table, rows: [[column.header], [value === '' ? null : value]], rowNumbers: [0, 1], source: 'xlsx' };
  const one: TableSpec = { ...spec, columns: spec.columns.filter((c) => c.name === canonicalName(column.name)) };
  parseTable(raw, one, units, problems);
  const found = problems.list.find((p) => p.severity === 'error');
  return found ? found.message : null;
}
