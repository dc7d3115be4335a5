/**
 * /api/projects/:projectId/models and /api/models — every role reads; engineers and above
 * edit and run (the review workflow adds its own routes later).
 */
import { Router } from 'express';
import { rolesAtLeast } from '../../shared/schemas/users.js';
import type { AppContext } from '../app.js';
import { currentUser, requireRole } from '../middleware/auth.js';
import { parseId } from '../middleware/params.js';
import { listRuns, startRun } from '../runs/run.service.js';
import { editMembers, editTables, getEditableMembers, getModelTables, getModelDetail, listModels, listVersions, renameModel } from './model.service.js';
import { forViewer, projectGuards, runVisibleTo } from '../membership/project-access.js';
import { assertModelEditable } from '../reviews/lock.js';
import { modelVersionWorkbook } from './model-workbook.js';

export const MODEL_READERS = rolesAtLeast('viewer');
export const MODEL_EDITORS = rolesAtLeast('engineer');

function optionalVersion(raw: unknown): number | undefined {
  if (raw === undefined || raw === '') return undefined;
  return parseId(String(raw), 'Version');
}

export function projectModelsRouter({ dataSource }: AppContext): Router {
  const router = Router({ mergeParams: true });
  const guard = projectGuards(dataSource);
  router.get('/', requireRole(...MODEL_READERS), guard.project('projectId'), async (req, res) => {
    res.json(await forViewer(dataSource, req.access!.role, await listModels(dataSource, parseId((req.params as Record<string, string>).projectId, 'Project'))));
  });
  return router;
}

export function modelsRouter({ dataSource }: AppContext): Router {
  const router = Router();
  const guard = projectGuards(dataSource);
  router.get('/:id', requireRole(...MODEL_READERS), guard.model('id'), async (req, res) => {
    res.json((await forViewer(dataSource, req.access!.role, [await getModelDetail(dataSource, parseId(req.params.id, 'Model'))]))[0]);
  });
  router.patch('/:id', requireRole(...MODEL_EDITORS), guard.model('id', 'engineer'), async (req, res) => {
    res.json(await renameModel(dataSource, parseId(req.params.id, 'Model'), req.body ?? {}));
  });
  router.get('/:id/versions', requireRole(...MODEL_READERS), guard.model('id'), async (req, res) => {
    res.json(await listVersions(dataSource, parseId(req.params.id, 'Model')));
  });
  for (const format of ['xlsx', 'zip'] as const) {
    router.get(`/:id/versions/:version/workbook.${format}`, requireRole(...MODEL_READERS), guard.model('id'), async (req, res) => {
      const file = await modelVersionWorkbook(dataSource, parseId(req.params.id, 'Model'), parseId(String(req.params.version), 'Version'), format);
      res.set('Content-Type', file.contentType);
      res.set('Content-Disposition', `attachment; filename="${file.fileName}"`);
      res.send(file.body);
    });
  }
  router.get('/:id/members', requireRole(...MODEL_READERS), guard.model('id'), async (req, res) => {
    res.json(await getEditableMembers(dataSource, parseId(req.params.id, 'Model'), optionalVersion(req.query.version)));
  });
  router.patch('/:id/members', requireRole(...MODEL_EDITORS), guard.model('id', 'engineer'), async (req, res) => {
    await assertModelEditable(dataSource, req.access!.modelId!);
    res.json(await editMembers(dataSource, parseId(req.params.id, 'Model'), currentUser(req).id, req.body ?? {}));
  });
  router.get('/:id/tables', requireRole(...MODEL_READERS), guard.model('id'), async (req, res) => {
    res.json(await getModelTables(dataSource, parseId(req.params.id, 'Model'), optionalVersion(req.query.version)));
  });
  router.patch('/:id/tables', requireRole(...MODEL_EDITORS), guard.model('id', 'engineer'), async (req, res) => {
    await assertModelEditable(dataSource, req.access!.modelId!);
    res.json(await editTables(dataSource, parseId(req.params.id, 'Model'), currentUser(req).id, req.body ?? {}));
  });
  router.get('/:id/runs', requireRole(...MODEL_READERS), guard.model('id'), async (req, res) => {
    const role = req.access!.role;
    res.json((await listRuns(dataSource, parseId(req.params.id, 'Model'))).filter((r) => runVisibleTo(role, r)));
  });
  router.post('/:id/runs', requireRole(...MODEL_EDITORS), guard.model('id', 'engineer'), async (req, res) => {
    res.status(202).json(await startRun(dataSource, parseId(req.params.id, 'Model'), currentUser(req).id, req.body ?? {}));
  });
  return router;
}
