/**
 * Lays out the calculation package with pdfkit: cover, contents, input summary, utilisation
 * schedule, then the calculation record of each chosen member with its N, V, M diagrams drawn
 * as vector plots from the station forces. Every page carries the caution and "Page i of n".
 *
 * The layout is run twice: the first pass only counts pages (so the contents and the footers
 * can name page numbers and the total), the second writes the file, chunk by chunk, to `sink`.
 * Both passes place everything identically, because the contents take the same room whatever
 * the numbers in them are.
 */
import PDFDocument from 'pdfkit';
import type { CheckRecord } from '../../shared/design/types.js';
import type { UnitSystem } from '../../shared/model/types.js';
import { unitOf, fromSI } from '../../shared/units/index.js';
import { fontRuns, robotoFaces, type FontFace, type Weight } from './fonts.js';
import { displayQuantity, formatRatio, formatValue, withUnit } from './format.js';
import type { ReportData, ReportMember } from './report-data.js';

/** The app's caution (src/components/CautionNotice.vue, short variant). */
export const REPORT_CAUTION = 'Results are for checking by a competent engineer. Local codes, national annexes and licensed practice govern.';

const PAGE_W = 595.28;
const PAGE_H = 841.89;
const LEFT = 50;
const RIGHT = PAGE_W - 50;
const WIDTH = RIGHT - LEFT;
const TOP = 72;
const BOTTOM = PAGE_H - 72;
const INK = '#1f2933';
const MUTED = '#5f6b7a';
const RULE = '#c5ccd6';
const ACCENT = '#1d4e89';
const STATUS_COLOUR: Record<string, string> = { pass: '#2e7d32', fail: '#c62828', 'not checked': '#8d6e00' };

export interface BuildOptions {
  /** chunks of the PDF as they are produced (second pass) */
  sink?: (chunk: Uint8Array) => void;
  /** members whose records are written so far */
  onProgress?: (done: number, total: number) => void;
  /** uncompressed content streams (tests read the text) */
  compress?: boolean;
}

interface TextOptions {
  size?: number;
  weight?: Weight;
  color?: string;
  /** right-align against x + width, or centre in it */
  align?: 'left' | 'right' | 'center';
  width?: number;
}

/** Where each contents entry starts (1-based page numbers). */
type Toc = Map<string, number>;

class Layout {
  readonly doc: PDFKit.PDFDocument;
  private readonly faces: Record<Weight, FontFace[]>;
  page = 0;
  y = TOP;
  section = '';

  constructor(
    private readonly data: ReportData,
    readonly totalPages: number,
    readonly toc: Toc,
    compress: boolean,
  ) {
    this.doc = new PDFDocument({ size: 'A4', margin: 0, autoFirstPage: false, compress, bufferPages: false,
      info: { Title: `Calculation package — ${data.cover.model} v${data.cover.version}, run ${data.cover.run}`, Creator: data.cover.software, Producer: 'Trestle' } });
    this.faces = { 400: robotoFaces(400), 700: robotoFaces(700) };
    for (const f of [...this.faces[400], ...this.faces[700]]) this.doc.registerFont(f.name, f.data);
  }

  /** widths at size 1 by weight and text (labels repeat on every page and record) */
  private readonly widths = new Map<string, number>();

  width(text: string, size = 9, weight: Weight = 400): number {
    const key = `${weight}\u0000${text}`;
    let unit = this.widths.get(key);
    if (unit === undefined) {
      unit = 0;
      for (const run of fontRuns(text, this.faces[weight])) unit += this.doc.font(run.face.name).fontSize(1).widthOfString(run.text);
      if (this.widths.size > 50_000) this.widths.clear();
      this.widths.set(key, unit);
    }
    return unit * size;
  }

  /** One line of text at (x, y); no wrapping, no page break. Returns its width. */
  text(text: string, x: number, y: number, o: TextOptions = {}): number {
    const size = o.size ?? 9;
    const weight = o.weight ?? 400;
    const w = this.width(text, size, weight);
    let at = x;
    if (o.width !== undefined && o.align === 'right') at = x + o.width - w;
    if (o.width !== undefined && o.align === 'center') at = x + (o.width - w) / 2;
    this.doc.fillColor(o.color ?? INK);
    for (const run of fontRuns(text, this.faces[weight])) {
      this.doc.font(run.face.name).fontSize(size).text(run.text, at, y, { lineBreak: false });
      at += this.doc.widthOfString(run.text);
    }
    return w;
  }

  /** Cuts text to fit a width (ending with …). */
  fit(text: string, width: number, size = 9, weight: Weight = 400): string {
    if (this.width(text, size, weight) <= width) return text;
    let s = text;
    while (s.length > 1 && this.width(`${s}…`, size, weight) > width) s = s.slice(0, -1);
    return `${s}…`;
  }

  /** Lines of `text` wrapped to `width`. */
  wrap(text: string, width: number, size = 9, weight: Weight = 400): string[] {
    const lines: string[] = [];
    for (const para of text.split('\n')) {
      let line = '';
      for (const word of para.split(/\s+/).filter(Boolean)) {
        const next = line ? `${line} ${word}` : word;
        if (line && this.width(next, size, weight) > width) {
          lines.push(line);
          line = word;
        } else line = next;
      }
      lines.push(line);
    }
    return lines;
  }

  /** A wrapped paragraph at the cursor; breaks the page between lines when needed. */
  para(text: string, o: TextOptions & { x?: number; gap?: number } = {}): void {
    const size = o.size ?? 9;
    const x = o.x ?? LEFT;
    const lh = size * 1.35;
    for (const line of this.wrap(text, o.width ?? RIGHT - x, size, o.weight)) {
      this.ensure(lh);
      this.text(line, x, this.y, { ...o, width: undefined, align: undefined });
      this.y += lh;
    }
    this.y += o.gap ?? 4;
  }

  rule(y: number, color = RULE, x0 = LEFT, x1 = RIGHT): void {
    this.doc.moveTo(x0, y).lineTo(x1, y).lineWidth(0.5).strokeColor(color).stroke();
  }

  newPage(section?: string): void {
    if (section !== undefined) this.section = section;
    this.doc.addPage({ size: 'A4', margin: 0 });
    this.page += 1;
    this.y = TOP;
    const c = this.data.cover;
    if (this.page > 1) {
      this.text(this.fit(`${c.project} · ${c.model} v${c.version} · run ${c.run}`, WIDTH * 0.62, 8), LEFT, 40, { size: 8, color: MUTED });
      this.text(this.section, LEFT, 40, { size: 8, color: MUTED, align: 'right', width: WIDTH });
      this.rule(53);
    }
    this.rule(BOTTOM + 14);
    this.text(this.fit(REPORT_CAUTION, WIDTH - 80, 7.5), LEFT, BOTTOM + 20, { size: 7.5, color: MUTED });
    this.text(`Page ${this.page} of ${this.totalPages || '?'}`, LEFT, BOTTOM + 20, { size: 7.5, color: MUTED, align: 'right', width: WIDTH });
  }

  ensure(height: number): void {
    if (this.y + height > BOTTOM) this.newPage();
  }

  heading(text: string, size = 14): void {
    this.ensure(size * 2.2);
    this.text(text, LEFT, this.y, { size, weight: 700, color: ACCENT });
    this.y += size * 1.6;
  }

  /** Label/value pairs in two columns. */
  facts(rows: [string, string][], labelWidth = 150): void {
    for (const [label, value] of rows) {
      const lines = this.wrap(value, WIDTH - labelWidth, 10);
      this.ensure(lines.length * 13.5 + 2);
      this.text(label, LEFT, this.y, { size: 10, color: MUTED });
      for (const line of lines) {
        this.text(line, LEFT + labelWidth, this.y, { size: 10 });
        this.y += 13.5;
      }
      this.y += 2;
    }
  }

  /** A table; columns are [title, width, align]. Repeats the header on each page. */
  table(columns: [string, number, 'left' | 'right'][], rows: { cells: string[]; color?: (string | undefined)[] }[], size = 8.5): void {
    const rowH = size * 1.55;
    const header = () => {
      this.ensure(rowH * 2);
      let x = LEFT;
      for (const [title, w, align] of columns) {
        this.text(this.fit(title, w - 6, size, 700), x + 3, this.y, { size, weight: 700, align, width: w - 6 });
        x += w;
      }
      this.y += rowH;
      this.rule(this.y - 3);
    };
    header();
    for (const row of rows) {
      if (this.y + rowH > BOTTOM) {
        this.newPage();
        header();
      }
      let x = LEFT;
      columns.forEach(([, w, align], i) => {
        this.text(this.fit(row.cells[i] ?? '', w - 6, size), x + 3, this.y, { size, align, width: w - 6, color: row.color?.[i] });
        x += w;
      });
      this.y += rowH;
    }
    this.y += 6;
  }
}

/* ---------- sections ---------- */

const ANALYSIS_LABEL: Record<string, string> = { first_order: 'first order', second_order: 'second order' };

function cover(l: Layout, d: ReportData): void {
  const c = d.cover;
  l.newPage('Cover');
  l.y = 120;
  l.text('Calculation package', LEFT, l.y, { size: 26, weight: 700, color: ACCENT });
  l.y += 40;
  l.text(`${c.project} — ${c.model}`, LEFT, l.y, { size: 14 });
  l.y += 34;
  const review = c.review.length
    ? c.review.map((e) => `${e.action} by ${e.by} on ${e.at}${e.message ? ` — “${e.message}”` : ''}`).join('\n')
    : 'no review steps yet (draft)';
  l.facts([
    ['Project', c.project],
    ['Model', c.model],
    ['Model version', String(c.version)],
    ['Run', String(c.run)],
    ['Design code', c.designCode],
    ['Analysis order', ANALYSIS_LABEL[c.analysis] ?? c.analysis],
    ['Analysis method', c.method],
    ['Unit system', c.units === 'us' ? 'US customary' : 'metric (SI)'],
    ['Run by', `${c.ranBy} on ${c.ranAt}`],
    ['Review status', c.reviewStatus],
    ['Review history', review],
    ['Members', `${c.counts.pass} pass, ${c.counts.fail} fail, ${c.counts.notChecked} not checked; largest ratio ${formatRatio(c.maxRatio)}`],
    ['Records included', c.selection],
    ['Software', c.software],
    ['Generated', c.generatedAt],
  ]);
  l.y += 16;
  l.doc.rect(LEFT, l.y, WIDTH, 44).fillColor('#fff4e5').fill();
  l.y += 8;
  l.para(REPORT_CAUTION, { x: LEFT + 10, width: WIDTH - 20, size: 10, color: '#7a3b00' });
}

function memberKey(m: ReportMember): string {
  return `member:${m.util.member}`;
}

function contents(l: Layout, d: ReportData): void {
  l.newPage('Contents');
  l.heading('Contents');
  const entries: [string, string, number][] = [
    ['Input summary', 'inputs', 0],
    ['Utilisation schedule', 'schedule', 0],
    ['Calculation records', 'records', 0],
    ...d.members.map((m): [string, string, number] => [`Member ${m.util.member} — ${m.util.section} — ratio ${formatRatio(m.util.ratio)} (${m.util.status})`, memberKey(m), 14]),
  ];
  for (const [title, key, indent] of entries) {
    l.ensure(14);
    l.text(l.fit(title, WIDTH - indent - 50, 10), LEFT + indent, l.y, { size: 10, weight: indent ? 400 : 700 });
    l.text(String(l.toc.get(key) ?? ''), LEFT, l.y, { size: 10, align: 'right', width: WIDTH });
    l.y += 14;
  }
}

function inputs(l: Layout, d: ReportData): void {
  l.newPage('Input summary');
  l.toc.set('inputs', l.page);
  l.heading('Input summary');
  l.text('Rows per table', LEFT, l.y, { size: 11, weight: 700 });
  l.y += 16;
  l.table([['Table', 200, 'left'], ['Rows', 80, 'right']], d.inputCounts.map(([t, n]) => ({ cells: [t, String(n)] })), 9);
  l.text('Settings', LEFT, l.y, { size: 11, weight: 700 });
  l.y += 16;
  l.table([['Setting', 200, 'left'], ['Value', WIDTH - 200, 'left']], d.settings.map(([k, v]) => ({ cells: [k, v] })), 9);
}

function schedule(l: Layout, d: ReportData): void {
  l.newPage('Utilisation schedule');
  l.toc.set('schedule', l.page);
  l.heading('Utilisation schedule');
  l.para('Every member with its governing ratio, the check and clause that govern and the combination they govern in.', { color: MUTED });
  l.table(
    [['Member', 58, 'left'], ['Section', 80, 'left'], ['Ratio', 44, 'right'], ['Governing check', 110, 'left'], ['Clause', 50, 'left'], ['Combination', 90, 'left'], ['Status', WIDTH - 432, 'left']],
    d.schedule.map((u) => ({
      cells: [u.member, u.section, formatRatio(u.ratio), u.check, u.clause, u.combination, u.status],
      color: [undefined, undefined, undefined, undefined, undefined, undefined, STATUS_COLOUR[u.status]],
    })),
  );
}

/** One force along the member as a filled line plot with its extreme values labelled. */
function plot(l: Layout, x0: number, y0: number, w: number, h: number, title: string, xs: number[], vs: number[], unit: string): void {
  const doc = l.doc;
  l.text(title, x0, y0, { size: 8.5, weight: 700 });
  const top = y0 + 14;
  const bottom = y0 + h;
  doc.rect(x0, top, w, bottom - top).lineWidth(0.4).strokeColor(RULE).stroke();
  const len = xs[xs.length - 1] - xs[0] || 1;
  const peak = Math.max(...vs.map(Math.abs));
  const noise = peak * 1e-9;
  const values = vs.map((v) => (Math.abs(v) <= noise ? 0 : v));
  const max = Math.max(0, ...values);
  const min = Math.min(0, ...values);
  const span = max - min || 1;
  const pad = 12;
  const sx = (x: number) => x0 + 4 + ((x - xs[0]) / len) * (w - 8);
  const sy = (v: number) => bottom - pad - ((v - min) / span) * (bottom - top - 2 * pad);
  const zero = sy(0);
  doc.save();
  doc.moveTo(sx(xs[0]), zero);
  xs.forEach((x, i) => doc.lineTo(sx(x), sy(values[i])));
  doc.lineTo(sx(xs[xs.length - 1]), zero).closePath().fillColor('#d6e4f5').fill();
  doc.restore();
  doc.moveTo(sx(xs[0]), sy(values[0]));
  xs.forEach((x, i) => doc.lineTo(sx(x), sy(values[i])));
  doc.lineWidth(1).strokeColor(ACCENT).stroke();
  doc.moveTo(x0 + 4, zero).lineTo(x0 + w - 4, zero).lineWidth(0.6).strokeColor(INK).stroke();
  const iMax = values.indexOf(Math.max(...values));
  const iMin = values.indexOf(Math.min(...values));
  const label = (i: number, above: boolean) => {
    const t = `${formatValue(values[i])} ${unit}`;
    const tw = l.width(t, 7);
    const lx = Math.min(Math.max(sx(xs[i]) - tw / 2, x0 + 2), x0 + w - tw - 2);
    l.text(t, lx, above ? sy(values[i]) - 9 : sy(values[i]) + 2, { size: 7, color: INK });
  };
  if (values[iMax] > 0) label(iMax, true);
  if (values[iMin] < 0) label(iMin, false);
  if (values[iMax] <= 0 && values[iMin] >= 0) l.text(`0 ${unit}`, x0 + 6, zero - 9, { size: 7, color: MUTED });
}

function diagrams(l: Layout, m: ReportMember, units: UnitSystem): void {
  const s = m.stations;
  if (!s || s.x.length < 2) {
    l.para('No station forces for this member.', { color: MUTED });
    return;
  }
  const force = unitOf('force', units);
  const moment = unitOf('moment', units);
  const conv = (a: number[], q: 'force' | 'moment') => a.map((v) => fromSI(v, q, units));
  const xs = s.x;
  const plots: [string, number[], string][] = [
    ['N (axial)', conv(s.N, 'force'), force],
    ['V major', conv(s.V_major, 'force'), force],
    ['M major', conv(s.M_major, 'moment'), moment],
  ];
  const minorPeak = Math.max(...s.M_minor.map(Math.abs), ...s.V_minor.map(Math.abs));
  const majorPeak = Math.max(1e-30, ...s.M_major.map(Math.abs), ...s.V_major.map(Math.abs));
  if (minorPeak > majorPeak * 1e-9) plots.push(['V minor', conv(s.V_minor, 'force'), force], ['M minor', conv(s.M_minor, 'moment'), moment]);
  const h = 96;
  const per = 3;
  const gap = 10;
  const w = (WIDTH - gap * (per - 1)) / per;
  for (let i = 0; i < plots.length; i += per) {
    l.ensure(h + 8);
    plots.slice(i, i + per).forEach(([title, vs, unit], j) => plot(l, LEFT + j * (w + gap), l.y, w, h, title, xs, vs, unit));
    l.y += h + 8;
  }
  l.para(`Along the member from its start node (0) to its end node (${withUnit(s.x[s.x.length - 1], 'length', units)}); loading ${m.loading}; local axes, signs as on the member page.`, { size: 7.5, color: MUTED });
}

function record(l: Layout, r: CheckRecord, units: UnitSystem): void {
  l.ensure(60);
  l.doc.rect(LEFT, l.y - 2, WIDTH, 15).fillColor('#eef2f7').fill();
  l.text(l.fit(`${r.clause} — ${r.title}`, WIDTH - 160, 9.5, 700), LEFT + 4, l.y + 1, { size: 9.5, weight: 700 });
  l.text(`ratio ${formatRatio(r.ratio)} · ${r.status}`, LEFT, l.y + 1, { size: 9.5, weight: 700, align: 'right', width: WIDTH - 4, color: STATUS_COLOUR[r.status] });
  l.y += 18;
  l.para(r.equation, { size: 9, x: LEFT + 4 });
  const rows: { cells: string[] }[] = [];
  const addInputs = (inputs: CheckRecord['inputs'], prefix = '') => {
    for (const inp of inputs) {
      const d = displayQuantity(inp.value, inp.quantity, units);
      rows.push({ cells: [prefix + inp.symbol, inp.name, d.text, d.unit] });
    }
  };
  addInputs(r.inputs);
  for (const part of r.axes ?? []) {
    addInputs(part.inputs, `${part.axis}: `);
    const d = displayQuantity(part.capacity, r.quantity, units);
    rows.push({ cells: [`${part.axis}: capacity`, `capacity about the ${part.axis} axis`, d.text, d.unit] });
  }
  const cap = displayQuantity(r.capacity, r.quantity, units);
  const dem = displayQuantity(r.demand, r.quantity, units);
  rows.push({ cells: ['capacity', 'design resistance', cap.text, cap.unit] });
  rows.push({ cells: ['demand', 'design effect', dem.text, dem.unit] });
  rows.push({ cells: ['ratio', 'demand / capacity', formatRatio(r.ratio), ''] });
  l.table([['Symbol', 90, 'left'], ['Quantity', 230, 'left'], ['Value', 100, 'right'], ['Unit', WIDTH - 420, 'left']], rows, 8);
  const where = r.x === null ? '' : ` at x = ${withUnit(r.x, 'length', units)}`;
  const extra = [
    `Combination ${r.combination || '—'}${where}${r.envelope ? ` (${r.envelope} envelope)` : ''}${r.vehiclePosition !== undefined ? `, leading axle at ${withUnit(r.vehiclePosition, 'length', units)}` : ''}`,
    r.analysis ? `Forces from: ${r.analysis}` : '',
    r.note ? `Note: ${r.note}` : '',
    r.stability ? `Stability: ${r.stability}` : '',
  ].filter(Boolean);
  for (const e of extra) l.para(e, { size: 8, color: MUTED, x: LEFT + 4, gap: 1 });
  l.y += 8;
}

function memberRecord(l: Layout, m: ReportMember, units: UnitSystem, first: boolean): void {
  if (first) l.newPage('Calculation records');
  else l.ensure(200);
  l.toc.set(memberKey(m), l.page);
  if (first) l.toc.set('records', l.page);
  const u = m.util;
  l.heading(`Member ${u.member}`, 13);
  l.para(`Section ${u.section} · material ${u.material} · group ${u.group || '—'} · length ${withUnit(u.length, 'length', units)} · governing ratio ${formatRatio(u.ratio)} (${u.check}, ${u.clause}, ${u.combination}) · ${u.status}`, { size: 9 });
  if (u.warnings.length) l.para(`Warnings: ${u.warnings.join('; ')}`, { size: 8.5, color: '#8d6e00' });
  diagrams(l, m, units);
  if (!m.records.length) l.para('No check records for this member.', { color: MUTED });
  for (const r of m.records) record(l, r, units);
  l.rule(l.y - 4);
  l.y += 8;
}

function layout(l: Layout, d: ReportData, onMember?: (i: number) => void): void {
  cover(l, d);
  contents(l, d);
  inputs(l, d);
  schedule(l, d);
  if (!d.members.length) {
    l.newPage('Calculation records');
    l.toc.set('records', l.page);
    l.heading('Calculation records');
    l.para('No member matched the selection.', { color: MUTED });
  }
  d.members.forEach((m, i) => {
    memberRecord(l, m, d.cover.units, i === 0);
    onMember?.(i + 1);
  });
}

/** Writes the PDF; resolves with the number of pages once the last chunk went to the sink. */
export async function buildReportPdf(data: ReportData, o: BuildOptions = {}): Promise<number> {
  const compress = o.compress ?? true;
  // pass 1: page numbers of the contents and the total
  const toc: Toc = new Map();
  const dry = new Layout(data, 0, toc, false);
  dry.doc.on('data', () => {});
  layout(dry, data);
  const total = dry.page;
  dry.doc.end();
  // pass 2: the file
  const l = new Layout(data, total, new Map(toc), compress);
  const finished = new Promise<void>((resolve, reject) => {
    l.doc.on('data', (chunk: Buffer) => o.sink?.(new Uint8Array(chunk.buffer, chunk.byteOffset, chunk.byteLength)));
    l.doc.on('end', () => resolve());
    l.doc.on('error', reject);
  });
  layout(l, data, (i) => o.onProgress?.(i, data.members.length));
  l.doc.end();
  await finished;
  return total;
}
