/**
 * The row-level model reader: raw tables (from CSV or XLSX) → a validated model in SI, or
 * the full list of problems. Pure: no file system. Never throws on bad input.
 */
import {
  FREEDOMS, type LoadCase, type Material, type Member, type MemberLoad, type MemberLoadKind, type Model, type MovingLoad,
  type Node, type NodeLoad, type Problem, type ReadResult, type Section, type SectionProps, type Settlement, type Six,
  type Support, type LaneMember, type VehicleAxle, type CaseCategory, type LoadDirection, type MemberType, type Release, type Combination,
  type ResultPoint,
} from '../model/types.js';
import { formatNumber, fromSI, toSI, unitOf, type Quantity } from '../units/index.js';
import { generatedCombinations, oneCombinationPerCase, readCombinationsTable } from './combinations.js';
import { detectPlaneFrame, inferVerticalAxis } from './inference.js';
import { lanePath } from './lanes.js';
import { readMaterials, readNetArea, readSections, resolveMaterial, resolveSection } from './library.js';
import { canonicalName } from './names.js';
import { Problems } from './problems.js';
import { readSettings } from './settings.js';
import { KNOWN_TABLES, TABLES } from './specs.js';
import { parseTable, type ParsedTable, type RawTable } from './table.js';

export interface ReadOptions {
  /** used as the title when the settings give none */
  fileName?: string;
}

/** Shapes each design code can check (tables.md shapes; `custom` has no shape to classify). */
const CODE_SHAPES: Record<string, readonly string[]> = {
  'aisc360-lrfd': ['i', 'channel', 'angle', 'tee', 'rhs', 'chs', 'rect', 'round'],
  'aisc360-asd': ['i', 'channel', 'angle', 'tee', 'rhs', 'chs', 'rect', 'round'],
  'en1993-1-1': ['i', 'channel', 'angle', 'tee', 'rhs', 'chs', 'rect', 'round'],
};

/** Unit of w1/w2 by load kind (tables.md "member_loads"). */
const KIND_QUANTITY: Record<MemberLoadKind, Quantity> = {
  point: 'force', moment: 'moment', uniform: 'line_load', linear: 'line_load', temperature: 'temperature', temperature_gradient: 'temperature',
};

/** The id column of each table that others refer to, and the columns that refer to it. */
const ID_COLUMN: Record<string, string> = { nodes: 'node', members: 'member', sections: 'section', materials: 'material', cases: 'case' };
const REFERENCES: Record<string, [string, string][]> = {
  nodes: [['supports', 'node'], ['members', 'start'], ['members', 'end'], ['node_loads', 'node'], ['settlements', 'node']],
  members: [['member_loads', 'member'], ['lanes', 'member'], ['result_points', 'member']],
  sections: [['members', 'section'], ['members', 'section_end']],
  materials: [['members', 'material']],
  cases: [['node_loads', 'case'], ['member_loads', 'case'], ['settlements', 'case'], ['combinations', 'case'], ['moving_loads', 'case']],
};

function fixity(v: unknown): boolean | undefined {
  if (v === undefined) return undefined;
  return v === '1' || v === 'fixed' || v === 'yes' || v === 'true';
}

function dist(a: Node, b: Node): number {
  return Math.hypot(a.x - b.x, a.y - b.y, a.z - b.z);
}

export function readTables(tables: RawTable[], options: ReadOptions = {}): ReadResult {
  const problems = new Problems();
  const counts: Record<string, number> = {};
  try {
    return readInner(tables, options, problems, counts);
  } catch (e) {
    problems.error('', undefined, undefined, `the model could not be read: ${(e as Error)?.message ?? String(e)}`);
    return { ok: false, problems: problems.list, counts, ...(problems.truncated ? { problemCounts: problems.counts() } : {}) };
  }
}

function readInner(tables: RawTable[], options: ReadOptions, problems: Problems, counts: Record<string, number>): ReadResult {
  // 1. tables by canonical name
  const raw = new Map<string, RawTable>();
  for (const t of tables) {
    const name = canonicalName(t.name);
    if (!KNOWN_TABLES.includes(name)) {
      problems.warning(t.name.trim(), undefined, undefined, `unknown table "${t.name.trim()}" is ignored (known: ${KNOWN_TABLES.join(', ')})`);
      continue;
    }
    if (raw.has(name)) {
      problems.error(name, undefined, undefined, `table ${name} is given twice`);
      continue;
    }
    raw.set(name, t);
  }

  // 2. settings first: they pick the unit system of every other table
  const sr = readSettings(raw.get('settings'), options.fileName ?? 'model', problems);
  const settings = sr.settings;
  if (raw.has('settings')) counts.settings = sr.count;
  const system = settings.units;

  const parsed: Record<string, ParsedTable | undefined> = {};
  for (const name of Object.keys(TABLES)) {
    if (name === 'settings') continue;
    const t = raw.get(name);
    if (!t) continue;
    parsed[name] = parseTable(t, TABLES[name], system, problems);
    counts[name] = parsed[name]!.rows.length;
  }
  for (const need of ['nodes', 'members']) {
    if (!raw.has(need)) problems.error(need, undefined, undefined, `the model needs a ${need} table`);
  }
  const lab = (table: string, col: string) => parsed[table]?.label[col] ?? col;
  // a table whose id column header was unusable has no ids: "unknown node N1" on every row that
  // names one would only follow from that header, so the naming columns are left out too
  for (const [table, refs] of Object.entries(REFERENCES)) {
    if (!parsed[table]?.unusable.has(ID_COLUMN[table])) continue;
    for (const [t, c] of refs) problems.markUnusable(t, c);
  }
  /** a length (SI) as the model's unit system writes it, for messages: `19.685 ft` */
  const len = (x: number) => `${formatNumber(fromSI(x, 'length', system))} ${unitOf('length', system)}`;

  // 3. nodes (a coordinate column whose header was unusable leaves the geometry unknown:
  // coincident nodes and zero-length members would only be follow-ons of that header)
  const geometryKnown = !['x', 'y', 'z'].some((c) => parsed.nodes?.unusable.has(c));
  const nodes = new Map<string, Node>();
  const coincident = new Map<string, Node>();
  const invalidNodes = new Set<string>();
  for (const r of parsed.nodes?.rows ?? []) {
    const id = r.v.node as string | undefined;
    if (id === undefined) continue;
    if (nodes.has(id)) {
      problems.error('nodes', r.row, lab('nodes', 'node'), `node ${id} is defined twice (first on row ${nodes.get(id)!.row})`);
      continue;
    }
    const n: Node = { id, x: (r.v.x as number) ?? 0, y: (r.v.y as number) ?? 0, z: (r.v.z as number | undefined) ?? 0, row: r.row };
    nodes.set(id, n);
    if (r.invalid || !geometryKnown) {
      invalidNodes.add(id);
      continue;
    }
    const key = [n.x, n.y, n.z].map((c) => Math.round(c * 1e6)).join(',');
    const other = coincident.get(key);
    if (other) problems.warning('nodes', r.row, lab('nodes', 'node'), `node ${id} is at the same place as node ${other.id} (row ${other.row})`);
    else coincident.set(key, n);
  }
  const nodeRef = (table: string, row: number, col: string, id: string | undefined): Node | undefined => {
    if (id === undefined) return undefined;
    const n = nodes.get(id);
    if (!n && raw.has('nodes')) problems.error(table, row, lab(table, col), `unknown node ${id}`);
    return n;
  };

  // 4. supports
  const supports: Support[] = [];
  const explicit: boolean[][] = [];
  const supportByNode = new Map<string, Support>();
  for (const r of parsed.supports?.rows ?? []) {
    const id = r.v.node as string | undefined;
    if (!nodeRef('supports', r.row, 'node', id) || id === undefined) continue;
    if (supportByNode.has(id)) {
      problems.error('supports', r.row, lab('supports', 'node'), `node ${id} has two support rows (first on row ${supportByNode.get(id)!.row})`);
      continue;
    }
    const type = r.v.type as string | undefined;
    const restrained = FREEDOMS.map((_, i) => type === 'fixed' || (type === 'pinned' && i < 3)) as Six<boolean>;
    const given = FREEDOMS.map(() => false);
    FREEDOMS.forEach((f, i) => {
      const v = fixity(r.v[f]);
      if (v !== undefined) { restrained[i] = v; given[i] = true; }
    });
    const springs = FREEDOMS.map((f) => (r.v[`k_${f}`] as number | undefined) ?? 0) as Six<number>;
    springs.forEach((k, i) => {
      if (k > 0 && restrained[i]) problems.warning('supports', r.row, lab('supports', `k_${FREEDOMS[i]}`), `node ${id}: ${FREEDOMS[i]} is restrained, so its spring has no effect`);
    });
    if (!restrained.some(Boolean) && !springs.some((k) => k > 0) && !r.invalid) {
      problems.warning('supports', r.row, lab('supports', 'node'), `node ${id}: the support restrains nothing (give a type, a freedom column or a spring)`);
    }
    const s: Support = { node: id, restrained, springs, row: r.row };
    supports.push(s);
    explicit.push(given);
    supportByNode.set(id, s);
  }
  if (raw.has('nodes') && !raw.has('supports')) problems.error('supports', undefined, undefined, 'the model needs a supports table');

  // 5. materials and sections
  const invalidMaterials = new Set<string>();
  const ownMaterials = readMaterials(parsed.materials, problems, invalidMaterials);
  const { sections: ownSections, invalid: invalidSections } = readSections(parsed.sections, problems, system);
  const usedMaterials = new Map<string, Material>();
  const usedSections = new Map<string, Section>();

  // inferences need nodes and supports only
  const verticalAxis = sr.verticalAxisGiven ? settings.verticalAxis : inferVerticalAxis([...nodes.values()]);
  settings.verticalAxis = verticalAxis;
  const planeFrame = detectPlaneFrame([...nodes.values()], supports, verticalAxis, explicit);

  // 6. members
  const members = new Map<string, Member>();
  const memberLength = new Map<string, number>();
  const memberSection = new Map<string, Section>();
  const memberMaterial = new Map<string, Material>();
  const requireReported = new Set<string>();
  const requireProps = (m: Member, s: Section, need: (keyof SectionProps)[], col: string, r: { row: number }) => {
    if (s.shape !== 'custom' || s.builtIn || invalidSections.has(s.id)) return;
    const missing = need.filter((p) => !s.given.includes(p));
    const key = `${s.id}\u0000${missing.join()}`;
    if (missing.length && !requireReported.has(key)) {
      requireReported.add(key);
      problems.error('sections', s.row, missing[0], `custom section ${s.id} is used by ${m.type} member ${m.id} (members row ${r.row}, ${col}) and needs ${missing.join(', ')}`);
    }
  };
  let checkable = 0;
  const uncheckable: { member: string; row: number; section: string; shape: string }[] = [];
  for (const r of parsed.members?.rows ?? []) {
    const v = r.v;
    const id = v.member as string | undefined;
    if (id === undefined) continue;
    if (members.has(id)) {
      problems.error('members', r.row, lab('members', 'member'), `member ${id} is defined twice (first on row ${members.get(id)!.row})`);
      continue;
    }
    const a = nodeRef('members', r.row, 'start', v.start as string | undefined);
    const b = nodeRef('members', r.row, 'end', v.end as string | undefined);
    const m: Member = {
      id,
      start: (v.start as string) ?? '',
      end: (v.end as string) ?? '',
      section: (v.section as string) ?? '',
      sectionEnd: v.section_end as string | undefined,
      material: (v.material as string) ?? '',
      type: (v.type as MemberType | undefined) ?? 'frame',
      roll: (v.roll as number | undefined) ?? 0,
      releaseStart: (v.release_start as Release | undefined) ?? 'fixed',
      releaseEnd: (v.release_end as Release | undefined) ?? 'fixed',
      group: v.group as string | undefined,
      kMajor: (v.k_major as number | undefined) ?? 1,
      kMinor: (v.k_minor as number | undefined) ?? 1,
      lMajor: v.l_major as number | undefined,
      lMinor: v.l_minor as number | undefined,
      lb: v.lb as number | undefined,
      cb: v.cb as number | undefined,
      deflectionLimit: v.deflection_limit as number | undefined,
      row: r.row,
    };
    members.set(id, m);
    if (a && b && !invalidNodes.has(a.id) && !invalidNodes.has(b.id)) {
      const L = dist(a, b);
      if (L > 1e-9) memberLength.set(id, L); // loads on a zero-length member are not judged again
      if (L <= 1e-9) problems.error('members', r.row, lab('members', 'end'), m.start === m.end ? `member ${id} starts and ends at node ${m.start}` : `member ${id} has zero length: nodes ${m.start} and ${m.end} are at the same place`);
    }
    let sec: Section | undefined;
    if (v.section !== undefined) {
      sec = resolveSection(m.section, ownSections, usedSections);
      if (!sec) problems.error('members', r.row, lab('members', 'section'), `unknown section ${m.section}: not in the sections table nor in the built-in catalogue`);
      else {
        memberSection.set(id, sec);
        requireProps(m, sec, m.type === 'truss' ? ['A'] : planeFrame ? ['A', 'I_major'] : ['A', 'I_major', 'I_minor', 'J'], 'section', r);
      }
    }
    if (m.sectionEnd !== undefined) {
      const se = resolveSection(m.sectionEnd, ownSections, usedSections);
      if (!se) problems.error('members', r.row, lab('members', 'section_end'), `unknown section ${m.sectionEnd}: not in the sections table nor in the built-in catalogue`);
      else {
        if (sec && se.shape !== sec.shape) problems.error('members', r.row, lab('members', 'section_end'), `member ${id} tapers from a ${sec.shape} section to a ${se.shape} section: section_end must have the same shape as section`);
        requireProps(m, se, m.type === 'truss' ? ['A'] : planeFrame ? ['A', 'I_major'] : ['A', 'I_major', 'I_minor', 'J'], 'section_end', r);
      }
    }
    if (v.material !== undefined) {
      const mat = resolveMaterial(m.material, ownMaterials, usedMaterials);
      if (!mat) problems.error('members', r.row, lab('members', 'material'), `unknown material ${m.material}: not in the materials table nor a built-in material`);
      else memberMaterial.set(id, mat);
    }
    // tension net area of this member (overrides the section's); An, Ae ≤ the smaller gross area
    const ends = m.sectionEnd !== undefined ? [sec, resolveSection(m.sectionEnd, ownSections, usedSections)] : [sec];
    const known = ends.every((x) => x !== undefined && !invalidSections.has(x.id) && x.props.A > 0);
    const grossA = known ? Math.min(...ends.map((x) => x!.props.A)) : undefined;
    const net = readNetArea('members', r.row, `member ${id}`, v, grossA, (c) => lab('members', c), problems, system);
    if (net) m.net = net;
    if (settings.designCode !== 'none' && sec) {
      if ((CODE_SHAPES[settings.designCode] ?? []).includes(sec.shape)) checkable++;
      else uncheckable.push({ member: id, row: r.row, section: sec.id, shape: sec.shape });
    }
  }
  // a design code the model's shapes cannot use: an error when no member can be checked,
  // a warning per member otherwise (its checks come out `not checked`)
  for (const u of uncheckable) {
    const what = u.shape === 'custom' ? 'custom (no shape to classify)' : `a ${u.shape} shape`;
    if (checkable === 0) {
      problems.error('members', u.row, lab('members', 'section'), `design code ${settings.designCode} cannot check member ${u.member}: section ${u.section} is ${what} and no member of the model has a shape the code can check; give shapes and dimensions, use catalogue sections, or set design_code none`);
      break;
    }
    problems.warning('members', u.row, lab('members', 'section'), `member ${u.member}: section ${u.section} is ${what}, so design code ${settings.designCode} reports its checks as not checked`);
  }
  // materials without fy under a design code
  if (settings.designCode !== 'none') {
    const reported = new Set<string>();
    for (const [mid, mat] of memberMaterial) {
      if (mat.fy !== undefined || reported.has(mat.id) || invalidMaterials.has(mat.id)) continue; // a bad fy cell is reported already
      reported.add(mat.id);
      problems.error('materials', mat.row, lab('materials', 'fy'), `material ${mat.id} has no fy, which design code ${settings.designCode} needs (used by member ${mid})`);
    }
  }
  for (const [id, m] of ownMaterials) {
    if (![...memberMaterial.values()].some((x) => x.id === id)) problems.warning('materials', m.row, lab('materials', 'material'), `material ${id} is not used by any member`);
  }

  // 7. cases
  const cases = new Map<string, LoadCase>();
  for (const r of parsed.cases?.rows ?? []) {
    const id = r.v.case as string | undefined;
    if (id === undefined) continue;
    if (cases.has(id)) {
      problems.error('cases', r.row, lab('cases', 'case'), `case ${id} is defined twice (first on row ${cases.get(id)!.row})`);
      continue;
    }
    cases.set(id, {
      id, category: (r.v.category as CaseCategory | undefined) ?? 'other', title: (r.v.title as string | undefined) ?? '',
      selfWeight: (r.v.self_weight as number | undefined) ?? 0,
      mass: r.v.mass === 'yes' || r.v.mass === 'true' || r.v.mass === '1', row: r.row,
    });
  }
  const caseRef = (table: string, row: number, id: string | undefined): boolean => {
    if (id === undefined) return false;
    if (cases.has(id)) return true;
    problems.error(table, row, lab(table, 'case'), `unknown case ${id}`);
    return false;
  };
  if (!raw.has('cases') && (raw.has('node_loads') || raw.has('member_loads') || raw.has('settlements'))) {
    problems.error('cases', undefined, undefined, 'loads are given but there is no cases table');
  }
  for (const c of cases.values()) {
    if (c.selfWeight === 0) continue;
    for (const [mid, mat] of memberMaterial) {
      if (mat.density > 0) continue;
      problems.warning('cases', c.row, lab('cases', 'self_weight'), `case ${c.id} has self weight but material ${mat.id} (member ${mid}) has no density`);
      break;
    }
  }

  // 8. node loads
  const nodeLoads: NodeLoad[] = [];
  for (const r of parsed.node_loads?.rows ?? []) {
    const okCase = caseRef('node_loads', r.row, r.v.case as string | undefined);
    const n = nodeRef('node_loads', r.row, 'node', r.v.node as string | undefined);
    if (!okCase || !n) continue;
    const values = ['fx', 'fy', 'fz', 'mx', 'my', 'mz'].map((k) => (r.v[k] as number | undefined) ?? 0) as Six<number>;
    nodeLoads.push({ case: r.v.case as string, node: n.id, values, row: r.row });
  }

  // 9. member loads
  const memberLoads: MemberLoad[] = [];
  for (const r of parsed.member_loads?.rows ?? []) {
    const v = r.v;
    const okCase = caseRef('member_loads', r.row, v.case as string | undefined);
    const mid = v.member as string | undefined;
    const m = mid !== undefined ? members.get(mid) : undefined;
    if (mid !== undefined && !m) problems.error('member_loads', r.row, lab('member_loads', 'member'), `unknown member ${mid}`);
    const kind = v.kind as MemberLoadKind | undefined;
    if (!okCase || !m || !kind || v.w1 === undefined) continue;
    const thermal = kind === 'temperature' || kind === 'temperature_gradient';
    let direction = v.direction as LoadDirection | undefined;
    if (!thermal && direction === undefined) {
      problems.error('member_loads', r.row, lab('member_loads', 'direction'), `a ${kind} load needs a direction (one of global_x, global_y, global_z, projected_x, projected_y, projected_z, local_x, local_y, local_z)`);
      continue;
    }
    if (thermal) direction = 'local_x';
    const L = memberLength.get(m.id) ?? 0;
    const q = KIND_QUANTITY[kind];
    const w1 = toSI(v.w1 as number, q, system);
    let w2 = v.w2 === undefined ? undefined : toSI(v.w2 as number, q, system);
    // w1/w2 take their unit from the kind, so they are converted here, not by the row parser
    const overflow = !Number.isFinite(w1) ? 'w1' : w2 !== undefined && !Number.isFinite(w2) ? 'w2' : undefined;
    if (overflow) {
      problems.error('member_loads', r.row, lab('member_loads', overflow), `${overflow} = ${v[overflow] as number} overflows when converted to SI units`);
      continue;
    }
    if ((kind === 'linear' || kind === 'temperature_gradient') && w2 === undefined) {
      problems.error('member_loads', r.row, lab('member_loads', 'w2'), `a ${kind} load needs w2`);
      continue;
    }
    if (kind !== 'linear' && kind !== 'temperature_gradient') {
      if (w2 !== undefined && w2 !== w1) problems.warning('member_loads', r.row, lab('member_loads', 'w2'), `w2 is not used by a ${kind} load`);
      w2 = w1;
    }
    let a = (v.a as number | undefined) ?? 0;
    let b: number;
    if (kind === 'point' || kind === 'moment') {
      if (v.b !== undefined) problems.warning('member_loads', r.row, lab('member_loads', 'b'), `b is not used by a ${kind} load (it acts at a)`);
      b = a;
    } else if (thermal) {
      a = 0;
      b = L;
    } else b = (v.b as number | undefined) ?? L;
    const tol = 1e-9 * Math.max(1, L);
    let bad = false;
    if (L > 0 && a > L + tol) {
      problems.error('member_loads', r.row, lab('member_loads', 'a'), `a = ${len(a)} is beyond the end of member ${m.id}, whose length is ${len(L)}`);
      bad = true;
    }
    if (L > 0 && b > L + tol && kind !== 'point' && kind !== 'moment') { // a point load's b is its a, reported above
      problems.error('member_loads', r.row, lab('member_loads', 'b'), `b = ${len(b)} is beyond the end of member ${m.id}, whose length is ${len(L)}`);
      bad = true;
    }
    if (!bad && memberLength.has(m.id) && (kind === 'uniform' || kind === 'linear') && !(b > a)) {
      problems.error('member_loads', r.row, lab('member_loads', 'b'), `b must be greater than a for a ${kind} load`);
      bad = true;
    }
    const mat = memberMaterial.get(m.id);
    if (thermal && mat && !(mat.alpha > 0)) {
      problems.error('member_loads', r.row, lab('member_loads', 'kind'), `a temperature load needs the coefficient of thermal expansion (alpha) of material ${mat.id}`);
      bad = true;
    }
    const sec = memberSection.get(m.id);
    if (kind === 'temperature_gradient' && sec && !(sec.props.depth > 0)) {
      problems.error('member_loads', r.row, lab('member_loads', 'kind'), `a temperature gradient needs the depth of section ${sec.id}`);
      bad = true;
    }
    if (m.type === 'truss' && !thermal && kind !== 'point' && kind !== 'uniform' && kind !== 'linear') {
      problems.error('member_loads', r.row, lab('member_loads', 'kind'), `truss member ${m.id} carries axial force only: a ${kind} load cannot act on it`);
      bad = true;
    }
    if (bad) continue;
    memberLoads.push({ case: v.case as string, member: m.id, kind, direction: direction!, a, b, w1, w2: w2!, row: r.row });
  }

  // 10. settlements
  const settlements: Settlement[] = [];
  const settled = new Set<string>();
  for (const r of parsed.settlements?.rows ?? []) {
    const okCase = caseRef('settlements', r.row, r.v.case as string | undefined);
    const n = nodeRef('settlements', r.row, 'node', r.v.node as string | undefined);
    if (!okCase || !n) continue;
    const key = `${r.v.case as string}\u0000${n.id}`;
    if (settled.has(key)) {
      problems.error('settlements', r.row, lab('settlements', 'node'), `node ${n.id} has two settlement rows in case ${r.v.case as string}`);
      continue;
    }
    settled.add(key);
    const s = supportByNode.get(n.id);
    const values = FREEDOMS.map((f) => (r.v[f] as number | undefined) ?? null) as Six<number | null>;
    let bad = false;
    FREEDOMS.forEach((f, i) => {
      if (values[i] !== null && !s?.restrained[i]) {
        problems.error('settlements', r.row, lab('settlements', f), `node ${n.id} is not restrained in ${f}: a settlement applies to a restrained freedom`);
        bad = true;
      }
    });
    if (!bad) settlements.push({ case: r.v.case as string, node: n.id, values, row: r.row });
  }

  // 11. combinations
  const caseList = [...cases.values()];
  let combinations: Combination[];
  const combRaw = raw.get('combinations');
  if (settings.combinationRule !== 'table') {
    if (combRaw) problems.warning('combinations', undefined, undefined, `combination_rule is ${settings.combinationRule}: the combinations table is ignored`);
    combinations = generatedCombinations(settings.combinationRule, caseList, problems);
    for (const c of combinations) {
      if (cases.has(c.id)) problems.error('cases', cases.get(c.id)!.row, lab('cases', 'case'), `case ${c.id} has the id of a combination generated by ${settings.combinationRule}: rename the case`);
    }
  } else if (combRaw) {
    const c = readCombinationsTable(combRaw, cases, system, problems);
    combinations = c.combinations;
    counts.combinations = c.count;
  } else combinations = oneCombinationPerCase(caseList);

  // 12. moving loads
  const vehicles: VehicleAxle[] = [];
  const axleKeys = new Map<string, number>();
  for (const r of parsed.vehicles?.rows ?? []) {
    const { vehicle, axle, offset, load } = r.v as { vehicle?: string; axle?: string; offset?: number; load?: number };
    if (vehicle === undefined || axle === undefined || offset === undefined || load === undefined) continue;
    const key = `${vehicle}\u0000${axle}`;
    if (axleKeys.has(key)) {
      problems.error('vehicles', r.row, lab('vehicles', 'axle'), `vehicle ${vehicle} has axle ${axle} twice (first on row ${axleKeys.get(key)})`);
      continue;
    }
    axleKeys.set(key, r.row);
    vehicles.push({ vehicle, axle, offset, load, row: r.row });
  }
  const lanes: LaneMember[] = [];
  const laneSeq = new Map<string, number>();
  for (const r of parsed.lanes?.rows ?? []) {
    const { lane, seq, member } = r.v as { lane?: string; seq?: number; member?: string };
    if (lane === undefined || seq === undefined || member === undefined) continue;
    if (!members.has(member)) {
      problems.error('lanes', r.row, lab('lanes', 'member'), `unknown member ${member}`);
      continue;
    }
    const key = `${lane}\u0000${seq}`;
    if (laneSeq.has(key)) {
      problems.error('lanes', r.row, lab('lanes', 'seq'), `lane ${lane} has seq ${seq} twice (first on row ${laneSeq.get(key)})`);
      continue;
    }
    laneSeq.set(key, r.row);
    lanes.push({ lane, seq, member, row: r.row });
  }
  lanes.sort((p, q) => (p.lane === q.lane ? p.seq - q.seq : 0));
  const laneIds = [...new Set(lanes.map((l) => l.lane))];
  for (const lane of laneIds) {
    const entries = lanes.filter((l) => l.lane === lane).sort((p, q) => p.seq - q.seq);
    const path = lanePath(entries, members);
    if (!path.ok) problems.error('lanes', entries[path.index].row, lab('lanes', 'member'), `lane ${lane}: ${path.message}`);
    // the moving-load engine needs prismatic lane members (shared/moving/influence.ts)
    for (const e of entries) {
      const m = members.get(e.member);
      if (m?.sectionEnd !== undefined && m.sectionEnd !== m.section) {
        problems.error('lanes', e.row, lab('lanes', 'member'), `lane ${lane}: member ${m.id} is tapered (section_end); a vehicle cannot run on a tapered member`);
      }
    }
  }
  const vehicleIds = new Set(vehicles.map((v) => v.vehicle));
  const movingLoads: MovingLoad[] = [];
  for (const r of parsed.moving_loads?.rows ?? []) {
    const { vehicle, lane, step, direction } = r.v as { vehicle?: string; lane?: string; step?: number; direction?: MovingLoad['direction'] };
    const okCase = caseRef('moving_loads', r.row, r.v.case as string | undefined);
    let ok = okCase;
    if (vehicle !== undefined && !vehicleIds.has(vehicle)) { problems.error('moving_loads', r.row, lab('moving_loads', 'vehicle'), `unknown vehicle ${vehicle}`); ok = false; }
    if (lane !== undefined && !laneIds.includes(lane)) { problems.error('moving_loads', r.row, lab('moving_loads', 'lane'), `unknown lane ${lane}`); ok = false; }
    if (!ok || vehicle === undefined || lane === undefined) continue;
    movingLoads.push({ case: r.v.case as string, vehicle, lane, step, direction: direction ?? 'both', row: r.row });
  }

  // 13. result points
  const resultPoints: ResultPoint[] = [];
  for (const r of parsed.result_points?.rows ?? []) {
    const mid = r.v.member as string | undefined;
    const x = r.v.x as number | undefined;
    if (mid === undefined) continue;
    if (!members.has(mid)) {
      problems.error('result_points', r.row, lab('result_points', 'member'), `unknown member ${mid}`);
      continue;
    }
    if (x === undefined) continue;
    const L = memberLength.get(mid);
    if (L === undefined) continue; // the member's own row already has an error
    if (x > L * (1 + 1e-9)) {
      problems.error('result_points', r.row, lab('result_points', 'x'), `x = ${len(x)} is beyond the end of member ${mid}, whose length is ${len(L)}`);
      continue;
    }
    resultPoints.push({ member: mid, x: Math.min(x, L), row: r.row });
  }

  // second order analyses each loading on its own; a moving-load envelope is a superposition
  if (settings.analysis === 'second_order' && (parsed.moving_loads?.rows.length ?? 0) > 0) {
    problems.error('settings', sr.rows.analysis, 'value', 'analysis = second_order cannot be combined with moving loads (table moving_loads): second order analyses each loading on its own, and moving-load envelopes need superposition; use first_order or remove the moving_loads table');
  }

  const model: Model = {
    settings,
    inferred: { verticalAxisInferred: !sr.verticalAxisGiven, planeFrame, defaulted: sr.defaulted },
    nodes: [...nodes.values()],
    supports,
    materials: [...ownMaterials.values(), ...usedMaterials.values()],
    sections: [...ownSections.values(), ...usedSections.values()],
    members: [...members.values()],
    cases: caseList,
    nodeLoads,
    memberLoads,
    settlements,
    combinations,
    vehicles,
    lanes,
    movingLoads,
    resultPoints,
  };
  // report in table order (settings first), then by row, keeping the order found within a row
  const order = ['', 'settings', ...KNOWN_TABLES.filter((t) => t !== 'settings')];
  const rank = (t: string) => (order.includes(t) ? order.indexOf(t) : order.length);
  const list: Problem[] = problems.list
    .map((p, i) => ({ p, i }))
    .sort((a, b) => rank(a.p.table) - rank(b.p.table) || (a.p.row ?? 0) - (b.p.row ?? 0) || a.i - b.i)
    .map((x) => x.p);
  const cut = problems.truncated ? { problemCounts: problems.counts() } : {};
  if (problems.hasErrors) return { ok: false, problems: list, counts, ...cut };
  return { ok: true, model, warnings: list, counts, ...cut };
}
