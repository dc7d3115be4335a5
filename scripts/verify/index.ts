/**
 * `npm run verify`: runs the verification tests (./vitest.config.ts) and writes the report
 * generated from them to docs/verification/ — report.html and report.pdf (the same records,
 * laid out by ./report-pdf.ts; both served by the app under /verification/ and linked from
 * About) and report.json.
 * Extra arguments are passed to vitest (e.g. a path filter); `--report-only` rebuilds the
 * report from the last run's results. Exits 1 when a test failed.
 */
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { buildReport, renderHtml, type VitestJson } from './report.js';
import { renderPdf } from './report-pdf.js';

const root = fileURLToPath(new URL('../../', import.meta.url));
const outDir = path.join(root, 'docs/verification');
const jsonFile = path.join(outDir, 'results.json');

function version(): string {
  const pkg = JSON.parse(readFileSync(path.join(root, 'package.json'), 'utf8')) as { version: string };
  try {
    const commit = execFileSync('git', ['rev-parse', '--short', 'HEAD'], { cwd: root, encoding: 'utf8' }).trim();
    const dirty = execFileSync('git', ['status', '--porcelain', '--', 'shared', 'server', 'tests'], { cwd: root, encoding: 'utf8' }).trim();
    return `${pkg.version} (commit ${commit}${dirty ? ', with uncommitted changes' : ''})`;
  } catch {
    return pkg.version;
  }
}

mkdirSync(outDir, { recursive: true });
const vitest = path.join(root, 'node_modules/vitest/vitest.mjs');
// `--report-only`: rebuild the report from the last run's results.json without running the tests
const reportOnly = process.argv.includes('--report-only');
if (!reportOnly) {
  const args = process.argv.slice(2);
  const run = spawnSync(process.execPath, [vitest, 'run', '--config', 'scripts/verify/vitest.config.ts', ...args], {
    cwd: root,
    stdio: 'inherit',
    env: { ...process.env, VERIFY_JSON: jsonFile },
  });
  if (run.status !== 0 && run.status !== 1) console.error(`verify: vitest exited with ${run.status}`);
}
if (!existsSync(jsonFile)) {
  console.error('verify: vitest wrote no results; no report written');
  process.exit(1);
}
const json = JSON.parse(readFileSync(jsonFile, 'utf8')) as VitestJson;
const report = buildReport(json, {
  software: 'Trestle',
  version: version(),
  date: new Date().toISOString().replace('T', ' ').replace(/\.\d+Z$/, ' UTC'),
  root,
  readFile: (f) => (existsSync(f) ? readFileSync(f, 'utf8') : undefined),
});
writeFileSync(path.join(outDir, 'report.json'), JSON.stringify(report, null, 1));
writeFileSync(path.join(outDir, 'report.html'), renderHtml(report));
writeFileSync(path.join(outDir, 'report.pdf'), await renderPdf(report));
const k = report.counts;
console.log(`verify: ${k.tests} problems (${k.passed} passed, ${k.failed} failed, ${k.skipped} skipped), ${k.records} comparisons → docs/verification/report.html and report.pdf`);
process.exit(k.failed > 0 ? 1 : 0);
