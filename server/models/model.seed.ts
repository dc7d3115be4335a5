/**
 * Seed hook: every sample in samples/ becomes a demo model (US-unit samples in the US demo
 * project, the others in the metric one), each with one completed run when the analysis and
 * checks succeed, so a new user sees results at once. A sample that fails to read is skipped.
 */
import { readFileSync } from 'node:fs';
import type { SeedContext } from '../db/seed.js';
import { readWorkbook } from '../../shared/reader/index.js';
import { listSamples } from '../samples/sample.router.js';
import { RunEntity, RunResultEntity } from '../runs/run.entity.js';
import { saveParts } from '../runs/result-parts.js';
import { encodeJson } from './model-codec.js';
import { createModelWithVersion } from './model.service.js';

const blob = (b: Uint8Array) => (b.byteLength > 0 ? Buffer.from(b.buffer, b.byteOffset, b.byteLength) : null);

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
      // in this thread: the seed runs once, before the server listens
      const { computeRun, packRun } = await import('../runs/run-compute.js');
      const started = new Date();
      const computed = computeRun(JSON.stringify(model), model.settings.designCode);
      const packed = packRun(computed.output, computed.analysed.model);
      const run = await seed.manager.getRepository(RunEntity).save({
        modelId: record.id, version: 1, designCode: model.settings.designCode, settingsJson: JSON.stringify(model.settings),
        status: 'done', phase: 'saving', progress: 1, message: '', reviewStatus: 'draft', maxRatio: packed.maxRatio,
        passCount: packed.counts.pass, failCount: packed.counts.fail, notCheckedCount: packed.counts.notChecked,
        timingsJson: JSON.stringify(packed.timings), diagnosticsJson: JSON.stringify(packed.diagnostics),
        stabilityJson: packed.stabilityJson,
        createdBy: seed.users.engineer.id, startedAt: started, finishedAt: new Date(),
      });
      await seed.manager.getRepository(RunResultEntity).insert({
        runId: run.id,
        membersData: Buffer.from(packed.membersData),
        recordsData: Buffer.from(packed.recordsData),
        loadingsJson: JSON.stringify(packed.loadings),
        nodeData: Buffer.from(packed.nodeData),
        nodeCount: packed.nodeCount,
        shapesData: blob(packed.shapesData),
        analysedModelData: blob(packed.analysedModelData),
      });
      await saveParts(seed.manager, run.id, packed.parts);
    } catch {
      // no run for this sample: the model is still there to run by hand
    }
  }
}
