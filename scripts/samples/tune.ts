/**
 * Prints each sample's schedule (governing ratio per member, worst first) to tune the demo
 * loads. Run: npx tsx scripts/samples/tune.ts footbridge-truss portal-frame-building plant-structure
 */
import { readFileSync } from 'node:fs';
import { readWorkbook, formatProblem } from '../../shared/reader/index.js';
import { analyse } from '../../shared/engine/index.js';
import { checkModel } from '../../shared/design/index.js';
for (const name of process.argv.slice(2)) {
  const r = await readWorkbook(readFileSync(`samples/${name}/${name}.xlsx`));
  if (!r.ok) { console.log(name, r.problems.map(formatProblem)); continue; }
  r.warnings.forEach((w) => console.log('  ', formatProblem(w)));
  try {
    const a = analyse(r.model);
    console.log(name, 'loadings', a.loadings.map((l) => l.id).join(' '), 'eq', Math.max(...a.diagnostics.equilibrium.map((e) => e.residual)).toExponential(2));
    const d = checkModel(r.model, a);
    const rows = [...d.members].sort((x, y) => (y.ratio ?? -1) - (x.ratio ?? -1));
    for (const m of rows) console.log(`  ${m.member.padEnd(8)} ${m.group.padEnd(16)} ${m.section.padEnd(10)} ${m.ratio?.toFixed(3) ?? '  -  '} ${m.status.padEnd(11)} ${m.check} ${m.clause} ${m.combination} ${JSON.stringify(m.families)}`);
  } catch (e) { console.log(name, 'ERR', (e as Error).message); }
}
