/**
 * /api/projects/:projectId/imports — upload (multer, in memory, limited), preview, commit.
 * Engineers and above; the guard runs before the upload is read.
 */
import { Router, type RequestHandler } from 'express';
import multer from 'multer';
import { rolesAtLeast } from '../../shared/schemas/users.js';
import type { AppContext } from '../app.js';
import { AppError, badRequest } from '../errors/app-error.js';
import { currentUser, requireRole } from '../middleware/auth.js';
import { parseId } from '../middleware/params.js';
import { describeBytes, importLimits, type ImportLimits } from './import-limits.js';
import { commitImport, getPreview, previewImport } from './import.service.js';
import { projectGuards } from '../membership/project-access.js';
import { assertModelEditable } from '../reviews/lock.js';
import { PendingImportEntity } from './pending-import.entity.js';

export const IMPORTERS = rolesAtLeast('engineer');

/** multer with our limits; its errors become clear 413/400 messages. */
function upload(limits: ImportLimits): RequestHandler {
  const parse = multer({ storage: multer.memoryStorage(), limits: { fileSize: limits.maxBytes, files: limits.maxFiles, fields: 20 } }).array(
    'files',
    limits.maxFiles,
  );
  const requestTooLarge = () =>
    new AppError(413, 'payload_too_large', `The upload is larger than the ${describeBytes(limits.maxRequestBytes)} limit per upload (IMPORT_MAX_REQUEST_MB)`);
  return (req, res, next) => {
    // the whole request, not only each file: refused from its Content-Length, or counted as it streams
    if (Number(req.headers['content-length']) > limits.maxRequestBytes) return next(requestTooLarge());
    let seen = 0;
    const count = (chunk: Buffer) => {
      seen += chunk.length;
      if (seen <= limits.maxRequestBytes) return;
      req.off('data', count);
      req.emit('error', requestTooLarge()); // multer stops, drains the rest and hands the error on
    };
    parse(req, res, (err: unknown) => {
      req.off('data', count);
      if (err instanceof AppError) return next(err);
      if (!err) return next();
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          return next(new AppError(413, 'payload_too_large', `${err.field ? 'A file' : 'The upload'} is larger than the ${describeBytes(limits.maxBytes)} limit (IMPORT_MAX_MB)`));
        }
        if (err.code === 'LIMIT_FILE_COUNT' || err.code === 'LIMIT_UNEXPECTED_FILE') {
          return next(badRequest(`Upload at most ${limits.maxFiles} files in the form field "files"`));
        }
        return next(badRequest(`The upload could not be read: ${err.message}`));
      }
      next(badRequest('The upload could not be read as multipart form data'));
    });
    req.on('data', count);
  };
}

export function importsRouter({ dataSource }: AppContext): Router {
  const router = Router({ mergeParams: true });
  const limits = importLimits();
  const projectId = (params: unknown) => parseId((params as Record<string, string>).projectId, 'Project');
  const guard = projectGuards(dataSource);

  router.post('/', requireRole(...IMPORTERS), guard.project('projectId', 'engineer'), upload(limits), async (req, res) => {
    const files = ((req.files as Express.Multer.File[] | undefined) ?? []).map((f) => ({
      name: Buffer.from(f.originalname, 'latin1').toString('utf8'),
      buffer: f.buffer,
    }));
    const body = (req.body ?? {}) as Record<string, unknown>;
    const fields = {
      modelId: typeof body.modelId === 'string' ? body.modelId : undefined,
      name: typeof body.name === 'string' ? body.name : undefined,
    };
    res.status(201).json(await previewImport(dataSource, projectId(req.params), currentUser(req).id, files, fields, limits));
  });

  router.get('/:importId', requireRole(...IMPORTERS), guard.project('projectId', 'engineer'), async (req, res) => {
    res.json(await getPreview(dataSource, projectId(req.params), String(req.params.importId)));
  });

  router.post('/:importId/commit', requireRole(...IMPORTERS), guard.project('projectId', 'engineer'), async (req, res) => {
    const pending = await dataSource.getRepository(PendingImportEntity).findOneBy({ id: String(req.params.importId), projectId: projectId(req.params) });
    if (pending?.modelId) await assertModelEditable(dataSource, pending.modelId);
    res.status(201).json(await commitImport(dataSource, projectId(req.params), String(req.params.importId), currentUser(req).id, req.body ?? {}));
  });

  return router;
}
