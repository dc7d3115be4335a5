/**
 * The verification report as a PDF (pdfkit, Roboto from server/reports/fonts.ts so φ, λ, ≤
 * print as in the HTML), laid out from the same VerificationReport as report.html: title
 * page with version, date and counts, then each chapter, each test file, each problem with
 * its source, location and comparisons (expected, computed, difference, tolerance). Every
 * page carries the caution and "Page i of n".
 */
import PDFDocument from 'pdfkit';
import { fontRuns, robotoFaces, type FontFace, type Weight } from '../../server/reports/fonts.js';
import { num, type Problem, type VerificationReport } from './report.js';

export const PDF_CAUTION = 'Results are for checking by a competent engineer. Local codes, national annexes and licensed practice govern.';

const PAGE_W = 595.28;
const PAGE_H = 841.89;
const LEFT = 50;
const WIDTH = PAGE_W - 100;
const TOP = 60;
const BOTTOM = PAGE_H - 70;
const INK = '#1f2933';
const MUTED = '#5f6b7a';
const ACCENT = '#1d4e89';
const STATUS_COLOUR: Record<Problem['status'], string> = { passed: '#2e7d32', failed: '#c62828', skipped: '#8d6e00' };
/** columns of a comparison row: expected, computed, difference, tolerance */
const COLS = [0, 0.34, 0.56, 0.76].map((f) => LEFT + 12 + f * (WIDTH - 12));

export interface PdfOptions {
  /** uncompressed content streams (tests read the text) */
  compress?: boolean;
}

class Writer {
  readonly doc: PDFKit.PDFDocument;
  private readonly faces: Record<Weight, FontFace[]>;
  y = TOP;

  constructor(title: string, compress: boolean) {
    this.doc = new PDFDocument({ size: 'A4', margin: 0, autoFirstPage: false, bufferPages: true, compress, info: { Title: title, Producer: 'Trestle' } });
    this.faces = { 400: robotoFaces(400), 700: robotoFaces(700) };
    for (const f of [...this.faces[400], ...this.faces[700]]) this.doc.registerFont(f.name, f.data);
    this.page();
  }

  page(): void {
    this.doc.addPage({ size: 'A4', margin: 0 });
    this.y = TOP;
  }

  /** room for `h` points on this page, else a new page */
  need(h: number): void {
    if (this.y + h > BOTTOM) this.page();
  }

  /** height of a text in a width (the widest face of the runs measures it) */
  height(text: string, size: number, weight: Weight, width: number): number {
    this.doc.font(this.faces[weight][0].name).fontSize(size);
    return this.doc.heightOfString(text, { width, lineGap: 1 });
  }

  /** text at (x, y) in runs of one face each; returns the height written */
  text(text: string, x: number, width: number, opts: { size?: number; weight?: Weight; color?: string; y?: number } = {}): number {
    const size = opts.size ?? 9;
    const weight = opts.weight ?? 400;
    const y = opts.y ?? this.y;
    const runs = fontRuns(text, this.faces[weight]);
    this.doc.fillColor(opts.color ?? INK).fontSize(size);
    runs.forEach((r, i) => {
      this.doc.font(r.face.name);
      if (i === 0) this.doc.text(r.text, x, y, { width, lineGap: 1, continued: i < runs.length - 1 });
      else this.doc.text(r.text, { width, lineGap: 1, continued: i < runs.length - 1 });
    });
    return this.height(text, size, weight, width);
  }

  /** a paragraph in the flow (moves y; breaks the page first when it would not fit) */
  para(text: string, opts: { size?: number; weight?: Weight; color?: string; indent?: number; after?: number } = {}): void {
    const x = LEFT + (opts.indent ?? 0);
    const w = WIDTH - (opts.indent ?? 0);
    const h = this.height(text, opts.size ?? 9, opts.weight ?? 400, w);
    this.need(h);
    this.text(text, x, w, opts);
    this.y += h + (opts.after ?? 2);
  }

  footers(report: VerificationReport): void {
    const range = this.doc.bufferedPageRange();
    for (let i = 0; i < range.count; i++) {
      this.doc.switchToPage(range.start + i);
      this.text(`${report.software} ${report.version} — verification report · ${PDF_CAUTION}`, LEFT, WIDTH - 70, { size: 7, color: MUTED, y: PAGE_H - 45 });
      this.text(`Page ${i + 1} of ${range.count}`, LEFT + WIDTH - 65, 65, { size: 7, color: MUTED, y: PAGE_H - 45 });
    }
  }
}

function problemBlock(w: Writer, p: Problem): void {
  const head = `${p.status.toUpperCase()}  ${p.description}`;
  w.need(Math.min(120, w.height(head, 9, 700, WIDTH) + 40));
  w.para(head, { weight: 700, color: p.status === 'passed' ? INK : STATUS_COLOUR[p.status], after: 1 });
  w.para(`Source: ${p.source}`, { size: 8, color: ACCENT, indent: 12, after: 1 });
  w.para(p.where, { size: 7.5, color: MUTED, indent: 12, after: 3 });
  if (p.records.length === 0) {
    w.para('No numbers registered while it ran; its expectations as written in the test:', { size: 8, color: MUTED, indent: 12, after: 1 });
    for (const line of p.assertions) w.para(line, { size: 7.5, indent: 20, after: 1 });
  } else {
    w.need(12);
    ['Expected', 'Computed', 'Difference / value', 'Tolerance'].forEach((h, i) => w.text(h, COLS[i], (COLS[i + 1] ?? LEFT + WIDTH) - COLS[i] - 4, { size: 7.5, weight: 700, color: MUTED }));
    w.y += 11;
    for (const r of p.records) {
      const cells = r.kind === 'within'
        ? [`${r.quantity ? `${r.quantity}: ` : ''}${num(r.expected)}`, num(r.computed), num(r.difference), r.tolerance]
        : ['—', '—', num(r.value), `${r.relation} ${num(r.bound)}`];
      const h = Math.max(...cells.map((c, i) => w.height(c, 8, 400, (COLS[i + 1] ?? LEFT + WIDTH) - COLS[i] - 4)));
      w.need(h + 2);
      cells.forEach((c, i) => w.text(c, COLS[i], (COLS[i + 1] ?? LEFT + WIDTH) - COLS[i] - 4, { size: 8 }));
      w.y += h + 2;
    }
    if (p.omitted > 0) w.para(`and ${p.omitted} more comparisons`, { size: 7.5, color: MUTED, indent: 12 });
  }
  w.y += 6;
}

/** The PDF bytes of the report. */
export function renderPdf(report: VerificationReport, options: PdfOptions = {}): Promise<Buffer> {
  const w = new Writer(`${report.software} ${report.version} — verification report`, options.compress ?? true);
  const chunks: Buffer[] = [];
  w.doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve, reject) => {
    w.doc.on('end', () => resolve(Buffer.concat(chunks)));
    w.doc.on('error', reject);
  });
  const k = report.counts;
  w.y = 140;
  w.para(`${report.software} — verification report`, { size: 22, weight: 700, color: ACCENT, after: 10 });
  w.para(`Software version ${report.version}`, { size: 11, after: 2 });
  w.para(`Generated ${report.date} by npm run verify from the verification tests themselves (titles, the source comments beside their expectations, and the numbers each comparison registered while it ran); never edited by hand. The same records give report.html.`, { size: 9.5, color: MUTED, after: 10 });
  w.para(`${k.tests} problems: ${k.passed} passed, ${k.failed} failed, ${k.skipped} skipped; ${k.records} numerical comparisons registered.`, { size: 11, weight: 700, after: 6 });
  w.para('Tolerances are as the tests state them: "rtol r" means |computed − expected| ≤ r·max(|computed|, |expected|) (some tests use max(1, …)), "±x" an absolute tolerance, "exact" equality.', { size: 9, after: 12 });
  w.para('Chapters', { size: 12, weight: 700, after: 4 });
  report.chapters.forEach((c, i) => w.para(`${i + 1}. ${c.title} (${c.files.reduce((n, f) => n + f.problems.length, 0)} problems)`, { size: 10, indent: 8, after: 2 }));
  w.y += 12;
  w.para(PDF_CAUTION, { size: 9, weight: 700, color: '#8d6e00' });
  report.chapters.forEach((c, i) => {
    w.page();
    w.para(`${i + 1}. ${c.title}`, { size: 16, weight: 700, color: ACCENT, after: 8 });
    for (const f of c.files) {
      w.need(60);
      w.para(f.file, { size: 10, weight: 700, after: 6 });
      for (const p of f.problems) problemBlock(w, p);
    }
  });
  w.footers(report);
  w.doc.end();
  return done;
}
