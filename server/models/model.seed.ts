/**
 * Seed hook: every sample in samples/ becomes a demo model (US-unit samples in the US demo
 * project, the others in the metric one), each with one completed run when the analysis and
 * checks succeed, so a new user sees results at once. A sample that fails to read is skipped.
 */
import { readFileSync } from 'node:fs';
import { gzipSync } from 'node:zlib';
import type { SeedContext } from '../db/seed.js';
import { readWorkbook } from '../../shared/reader/index.js';
import { maxRatio, statusCounts } from '../../shared/results/member-rows.js';
import { listSamples } from '../samples/sample.router.js';
import { RunEntity, RunResultEntity } from '../runs/run.entity.js';
import { encodeJson } from './model-codec.js';
import { createModelWithVersion } from './model.service.js';

export async function seedSampleModels(seed: SeedContext): Promise<void> {
  const [metricProject, usProject] = seed.projects;
  for (const sample of listSamples()) {
    const buffer = readFileSync(sample.file);
    let result;
    try {
      result = await readWorkbook(buffer);
    } catch {
      continue;
    }
    if (!result.ok) continue;
    const model = result.model;
    const project = model.settings.units === 'us' && usProject ? usProject : metricProject;
    const record = await createModelWithVersion(seed.manager, project.id, model.settings.title || sample.info.title, {
      model,
      counts: result.counts,
      origin: 'import',
      message: `Demo model from samples/${sample.info.name}`,
      sourceData: encodeJson([{ name: `${sample.info.name}.xlsx`, base64: buffer.toString('base64') }]),
      createdBy: seed.users.engineer.id,
    });
    try {
      const { computeRun } = await import('../runs/run-compute.js');
      const started = new Date();
      const { output } = computeRun(JSON.stringify(model), model.settings.designCode);
      const counts = statusCounts(output.members);
      const run = await seed.manager.getRepository(RunEntity).save({
        modelId: record.id, version: 1, designCode: model.settings.designCode, settingsJson: JSON.stringify(model.settings),
        status: 'done', phase: 'saving', progress: 1, message: '', reviewStatus: 'draft', maxRatio: maxRatio(output.members),
        passCount: counts.pass, failCount: counts.fail, notCheckedCount: counts.notChecked, timingsJson: JSON.stringify(output.timings),
        diagnosticsJson: JSON.stringify(output.diagnostics), createdBy: seed.users.engineer.id, startedAt: started, finishedAt: new Date(),
      });
      const d = output.displacements;
      const r = output.reactions;
      await seed.manager.getRepository(RunResultEntity).insert({
        runId: run.id,
        membersData: encodeJson(output.members),
        recordsData: encodeJson(output.records),
        loadingsJson: JSON.stringify(output.loadings),
        nodeData: gzipSync(Buffer.concat([Buffer.from(d.buffer, d.byteOffset, d.byteLength), Buffer.from(r.buffer, r.byteOffset, r.byteLength)]), { level: 1 }),
        nodeCount: output.nodeCount,
      });
    } catch {
      // no run for this sample: the model is still there to run by hand
    }
  }
}
