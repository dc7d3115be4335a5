/**
 * The verification report, built from the tests themselves: vitest's JSON report of the
 * verification run (titles, status, location, and the records ./setup.ts put in each test's
 * meta) and the test files' text (the source comments beside the expectations). Pure: the
 * caller reads the files; nothing here touches the file system.
 */
import { META_KEY, type VerificationRecord } from './records.js';

/** The part of vitest's JSON reporter output the report reads. */
export interface VitestJson {
  testResults: {
    name: string;
    assertionResults: {
      ancestorTitles: string[];
      fullName: string;
      title: string;
      status: string;
      failureMessages?: string[];
      location?: { line: number; column: number } | null;
      meta?: Record<string, unknown>;
    }[];
  }[];
}

export interface Problem {
  /** describe blocks and title, as the test says what is expected */
  description: string;
  /** the sources named by the title and by the comments in the test's body */
  source: string;
  status: 'passed' | 'failed' | 'skipped';
  /** test file relative to the repository, with the line of the test */
  where: string;
  records: VerificationRecord[];
  /** records beyond the per-test limit */
  omitted: number;
  /** the test's expectation lines as written, shown when it registered no numbers */
  assertions: string[];
}

export interface Chapter {
  title: string;
  /** test files of the chapter, each with its problems */
  files: { file: string; problems: Problem[] }[];
}

export interface VerificationReport {
  software: string;
  version: string;
  date: string;
  chapters: Chapter[];
  counts: { tests: number; passed: number; failed: number; skipped: number; records: number };
}

/** Chapter of a test file, by folder; unknown folders get their own chapter. */
export const CHAPTERS: [prefix: string, title: string][] = [
  ['tests/shared/engine/', 'Analysis (direct stiffness method)'],
  ['tests/shared/design/', 'Design checks'],
  ['tests/shared/moving/', 'Moving loads'],
  ['tests/shared/stability/', 'Stability and second-order analysis'],
  ['tests/shared/sections/', 'Section properties and catalogue'],
  ['tests/samples/', 'Sample models'],
];

export function chapterOf(file: string): string {
  const hit = CHAPTERS.find(([prefix]) => file.startsWith(prefix));
  return hit ? hit[1] : file.split('/').slice(0, -1).join('/');
}

/** Words that mark a reference: a standard, a handbook, a closed form, a recalled value. */
const SOURCE_WORDS =
  /\b(EN ?\d{3,5}|EN ?199\d|Eurocode|AISC|ASCE|SEI|AASHTO|ASTM|DIN|BS ?\d|Roark|Timoshenko|Gere|Przemieniecki|Bathe|Chen|Trahair|Galambos|SCI|Design Guide|Table|Chapter [A-N]|clause|Eq\. ?[A-Z]?\d|equation|Annex|Appendix|closed[- ]form|formula|from memory|handbook|worked example|textbook|exact|analytic|theory|Euler|Bredt|Castigliano|Maxwell|Müller-Breslau|influence line|statics|method of (?:joints|sections)|slope[- ]deflection|moment distribution|virtual work|[A-K]\d{1,2}(?:\.\d+)?[a-z]?|\d+\.\d+\.\d+(?:\.\d+)*)\b|§|cl\. ?\d/i;

/** Parenthesised fragments of a title, and its clauses after a colon, that name a source. */
export function sourcesInTitle(title: string): string[] {
  const out: string[] = [];
  for (const m of title.matchAll(/\(([^()]*(?:\([^()]*\)[^()]*)*)\)/g)) if (SOURCE_WORDS.test(m[1])) out.push(m[1].trim());
  if (out.length === 0 && SOURCE_WORDS.test(title)) out.push(title.trim());
  return out;
}

/**
 * The text of the test that starts on `line` (1-based): from that line to the line where
 * its parentheses balance (strings and comments skipped), at most 400 lines.
 */
export function testBody(text: string, line: number): string {
  const lines = text.split('\n');
  const start = Math.max(0, line - 1);
  let depth = 0, seen = false;
  let quote: string | null = null;
  for (let i = start; i < Math.min(lines.length, start + 400); i++) {
    const l = lines[i];
    for (let j = 0; j < l.length; j++) {
      const ch = l[j];
      if (quote) {
        if (ch === '\\') j++;
        else if (ch === quote) quote = null;
        continue;
      }
      if (ch === '/' && l[j + 1] === '/') break;
      if (ch === "'" || ch === '"' || ch === '`') quote = ch;
      else if (ch === '(') { depth++; seen = true; }
      else if (ch === ')') {
        depth--;
        if (seen && depth === 0) return lines.slice(start, i + 1).join('\n');
      }
    }
    if (quote !== '`') quote = null; // a string never spans lines, a template may
  }
  return lines.slice(start, start + 400).join('\n');
}

/** Comments of a test body that name a source (the comment beside an expectation). */
export function sourcesInComments(body: string): string[] {
  const out: string[] = [];
  for (const m of body.matchAll(/\/\/\s?(.*)$|\/\*+([\s\S]*?)\*\//gm)) {
    const c = (m[1] ?? m[2] ?? '').replace(/\s*\n\s*\*?\s*/g, ' ').trim();
    if (c && SOURCE_WORDS.test(c) && !out.includes(c)) out.push(c);
  }
  return out;
}

/** The lines of a test body that assert something (at most 8), trimmed. */
export function expectationLines(body: string): string[] {
  return body
    .split('\n')
    .filter((l) => /\bexpect(\.soft)?\(|\bclose\(|\bwithin\(|\bverification\(/.test(l))
    .map((l) => l.trim())
    .slice(0, 8);
}

function isRecord(x: unknown): x is VerificationRecord {
  return typeof x === 'object' && x !== null && ((x as { kind?: unknown }).kind === 'within' || (x as { kind?: unknown }).kind === 'bound');
}

export interface BuildOptions {
  software: string;
  version: string;
  date: string;
  /** repository root, to make the test file paths relative */
  root: string;
  /** the text of a test file (absolute path), or undefined when it cannot be read */
  readFile: (path: string) => string | undefined;
}

export function buildReport(json: VitestJson, opts: BuildOptions): VerificationReport {
  const root = opts.root.replace(/\\/g, '/').replace(/\/?$/, '/');
  const chapters = new Map<string, Chapter>();
  const counts = { tests: 0, passed: 0, failed: 0, skipped: 0, records: 0 };
  const files = [...json.testResults].sort((a, b) => a.name.localeCompare(b.name));
  for (const f of files) {
    const abs = f.name.replace(/\\/g, '/');
    const file = abs.startsWith(root) ? abs.slice(root.length) : abs;
    const text = opts.readFile(f.name);
    const title = chapterOf(file);
    let chapter = chapters.get(title);
    if (!chapter) chapters.set(title, (chapter = { title, files: [] }));
    const problems: Problem[] = [];
    for (const t of f.assertionResults) {
      const line = t.location?.line;
      const body = text !== undefined && line ? testBody(text, line) : '';
      const fromTitle = [...t.ancestorTitles, t.title].flatMap(sourcesInTitle);
      const explicit: string[] = [];
      const raw = t.meta?.[META_KEY];
      const records = Array.isArray(raw) ? raw.filter(isRecord) : [];
      for (const r of records) if (r.kind === 'within' && r.source && !explicit.includes(r.source)) explicit.push(r.source);
      const sources = [...new Set([...fromTitle, ...explicit, ...sourcesInComments(body)])];
      if (sources.length === 0 && / = /.test(t.title)) sources.push('the closed form or worked values stated in the title');
      const status = t.status === 'passed' ? 'passed' : t.status === 'failed' ? 'failed' : 'skipped';
      counts.tests++;
      counts[status]++;
      counts.records += records.length;
      problems.push({
        description: [...t.ancestorTitles, t.title].join(' › '),
        source: sources.length > 0 ? sources.join('; ') : 'no source named in the test (an invariant or a behaviour check)',
        status,
        where: line ? `${file}:${line}` : file,
        records,
        omitted: Number(t.meta?.[`${META_KEY}Omitted`] ?? 0),
        assertions: records.length > 0 ? [] : expectationLines(body),
      });
    }
    chapter.files.push({ file, problems });
  }
  const order = CHAPTERS.map(([, t]) => t);
  const rank = (t: string) => (order.indexOf(t) < 0 ? order.length : order.indexOf(t));
  return {
    software: opts.software,
    version: opts.version,
    date: opts.date,
    chapters: [...chapters.values()].sort((a, b) => rank(a.title) - rank(b.title) || a.title.localeCompare(b.title)),
    counts,
  };
}

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** A number as the report shows it: 6 significant digits. */
export function num(x: number): string {
  if (x === 0) return '0';
  const a = Math.abs(x);
  return a >= 1e-3 && a < 1e7 ? String(Number(x.toPrecision(6))) : x.toExponential(5).replace(/\.?0+e/, 'e');
}

function recordRows(p: Problem): string {
  if (p.records.length === 0) {
    const lines = p.assertions.length > 0 ? `<pre>${esc(p.assertions.join('\n'))}</pre>` : '';
    return `<tr class="rec"><td colspan="4"><span class="muted">no numbers registered while it ran; its expectations as written in the test:</span>${lines}</td></tr>`;
  }
  const rows = p.records.map((r) =>
    r.kind === 'within'
      ? `<tr class="rec"><td>${r.quantity ? `${esc(r.quantity)}: ` : ''}${num(r.expected)}</td><td>${num(r.computed)}</td><td>${num(r.difference)}</td><td>${esc(r.tolerance)}</td></tr>`
      : `<tr class="rec"><td class="muted">—</td><td class="muted">—</td><td>${num(r.value)}</td><td>${r.relation} ${num(r.bound)}</td></tr>`,
  );
  if (p.omitted > 0) rows.push(`<tr class="rec"><td colspan="4" class="muted">and ${p.omitted} more comparisons</td></tr>`);
  return rows.join('\n');
}

export function renderHtml(r: VerificationReport): string {
  const toc = r.chapters.map((c, i) => `<li><a href="#ch${i + 1}">${i + 1}. ${esc(c.title)}</a> (${c.files.reduce((n, f) => n + f.problems.length, 0)})</li>`).join('\n');
  const body = r.chapters
    .map((c, i) => {
      const files = c.files
        .map((f) => {
          const problems = f.problems
            .map(
              (p) => `<tbody class="problem ${p.status}" data-test="verification-problem">
<tr class="head"><td colspan="4"><span class="status">${p.status}</span> ${esc(p.description)}<div class="source">Source: ${esc(p.source)}</div><div class="where">${esc(p.where)}</div></td></tr>
${recordRows(p)}
</tbody>`,
            )
            .join('\n');
          return `<h3>${esc(f.file)}</h3>
<table><thead><tr><th>Expected</th><th>Computed</th><th>Difference (or checked value)</th><th>Tolerance</th></tr></thead>
${problems}
</table>`;
        })
        .join('\n');
      return `<section id="ch${i + 1}"><h2>${i + 1}. ${esc(c.title)}</h2>\n${files}</section>`;
    })
    .join('\n');
  const k = r.counts;
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><title>${esc(r.software)} ${esc(r.version)} — verification report</title>
<style>
body{font:14px/1.45 system-ui,sans-serif;margin:2rem auto;max-width:1100px;padding:0 1rem;color:#222}
h1{margin-bottom:.2rem}h2{margin-top:2.5rem;border-bottom:2px solid #345}h3{margin:1.5rem 0 .3rem;font-size:1rem;font-family:monospace}
table{border-collapse:collapse;width:100%;margin-bottom:1rem}th,td{border:1px solid #ccd;padding:.25rem .45rem;text-align:left;vertical-align:top}
th{background:#eef1f5}tr.head td{background:#f7f8fa}.source{color:#345;font-size:.9em;margin-top:.2rem}.where,.muted{color:#778;font-size:.85em}
.status{display:inline-block;min-width:4.5em;font-weight:600;text-transform:uppercase;font-size:.75em}
pre{margin:.3rem 0 0;white-space:pre-wrap;font-size:.85em}.passed .status{color:#176}.failed .status{color:#b00}.skipped .status{color:#886}td:not([colspan]){font-family:monospace}
@media print{section{page-break-before:always}}
</style></head>
<body>
<h1>${esc(r.software)} — verification report</h1>
<p>Software version <strong>${esc(r.version)}</strong>, generated ${esc(r.date)} by <code>npm run verify</code> from the verification tests themselves
(titles, the source comments beside their expectations, and the numbers each comparison registered while it ran); never edited by hand.</p>
<p>${k.tests} problems: ${k.passed} passed, ${k.failed} failed, ${k.skipped} skipped; ${k.records} numerical comparisons registered.
Tolerances are as the tests state them: "rtol r" means |computed − expected| ≤ r·max(|computed|, |expected|) (some tests use max(1, …)), "±x" an absolute tolerance, "exact" equality.</p>
<ol>${toc}</ol>
${body}
</body></html>
`;
}
