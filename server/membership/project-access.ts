/**
 * Who may do what on a project: the one place that decides it.
 *
 * The effective role on a project is `admin` for admins; for anyone else the lower of their
 * project role (project_members) and their account role. A user who is not a member gets
 * 404 for the project and everything in it (models, imports, runs, exports, comments,
 * reviews), exactly as if it did not exist.
 */
import type { RequestHandler } from 'express';
import type { DataSource } from 'typeorm';
import { hasRoleAtLeast, ROLES, type Role } from '../../shared/schemas/users.js';
import { forbidden, notFound } from '../errors/app-error.js';
import { currentUser } from '../middleware/auth.js';
import { parseId } from '../middleware/params.js';
import { ModelEntity } from '../models/model.entity.js';
import { ProjectEntity } from '../projects/project.entity.js';
import { RunEntity, type RunRecord } from '../runs/run.entity.js';
import type { UserRecord } from '../users/user.entity.js';
import { ProjectMemberEntity } from './member.entity.js';

/** What a guard found out, kept on the request for handlers and the audit trail. */
export interface RequestAccess {
  projectId: number;
  role: Role;
  modelId?: number;
  version?: number;
  runId?: number;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Request {
      /** Set by the project guards of server/membership/project-access.ts. */
      access?: RequestAccess;
    }
  }
}

const lower = (a: Role, b: Role): Role => (ROLES.indexOf(a) <= ROLES.indexOf(b) ? a : b);

/** The effective role of `user` on a project, or null when they are not a member. */
export async function effectiveRole(ds: DataSource, user: UserRecord, projectId: number): Promise<Role | null> {
  if (user.role === 'admin') return 'admin';
  const member = await ds.getRepository(ProjectMemberEntity).findOneBy({ projectId, userId: user.id });
  return member ? lower(member.role, user.role) : null;
}

/**
 * The effective role of `user` on an existing project: 404 when the project does not exist
 * or the user is not a member, 403 when the role is below `minRole`.
 */
export async function projectAccess(ds: DataSource, user: UserRecord, projectId: number, minRole: Role = 'viewer'): Promise<Role> {
  const exists = await ds.getRepository(ProjectEntity).existsBy({ id: projectId });
  const role = exists ? await effectiveRole(ds, user, projectId) : null;
  if (!role) throw notFound(`Project ${projectId} not found`);
  if (!hasRoleAtLeast(role, minRole)) throw forbidden(`Your role on this project (${role}) does not allow this`);
  return role;
}

/** Ids of the projects a user belongs to; null for admins (every project). */
export async function visibleProjectIds(ds: DataSource, user: UserRecord): Promise<Set<number> | null> {
  if (user.role === 'admin') return null;
  const rows = await ds.getRepository(ProjectMemberEntity).find({ where: { userId: user.id }, select: { projectId: true } });
  return new Set(rows.map((r) => r.projectId));
}

export async function modelAccess(ds: DataSource, user: UserRecord, modelId: number, minRole: Role = 'viewer'): Promise<RequestAccess> {
  const model = await ds.getRepository(ModelEntity).findOne({ where: { id: modelId }, select: { id: true, projectId: true, currentVersion: true } });
  if (!model) throw notFound(`Model ${modelId} not found`);
  const role = await effectiveRole(ds, user, model.projectId);
  if (!role) throw notFound(`Model ${modelId} not found`);
  if (!hasRoleAtLeast(role, minRole)) throw forbidden(`Your role on this project (${role}) does not allow this`);
  return { projectId: model.projectId, role, modelId, version: model.currentVersion };
}

/** Viewers see approved runs only; anything else of theirs is 404. */
export function runVisibleTo(role: Role, run: Pick<RunRecord, 'reviewStatus'>): boolean {
  return role !== 'viewer' || run.reviewStatus === 'approved';
}

export async function runAccess(ds: DataSource, user: UserRecord, runId: number, minRole: Role = 'viewer'): Promise<RequestAccess & { run: RunRecord }> {
  const run = await ds.getRepository(RunEntity).findOneBy({ id: runId });
  const model = run ? await ds.getRepository(ModelEntity).findOne({ where: { id: run.modelId }, select: { id: true, projectId: true } }) : null;
  const role = model ? await effectiveRole(ds, user, model.projectId) : null;
  if (!run || !model || !role || !runVisibleTo(role, run)) throw notFound(`Run ${runId} not found`);
  if (!hasRoleAtLeast(role, minRole)) throw forbidden(`Your role on this project (${role}) does not allow this`);
  return { projectId: model.projectId, role, modelId: run.modelId, version: run.version, runId, run };
}

type ParamSource = (req: Parameters<RequestHandler>[0]) => unknown;
const param =
  (name: string): ParamSource =>
  (req) =>
    (req.params as Record<string, string>)[name];

/**
 * Route guards, placed after `requireRole(...)`:
 *
 *   router.get('/:id', requireRole(...READERS), guard.model('id'), handler)
 *   router.patch('/:id/members', requireRole(...EDITORS), guard.model('id', 'engineer'), handler)
 *
 * Each sets `req.access` ({ projectId, role, modelId?, version?, runId? }).
 */
export function projectGuards(ds: DataSource) {
  return {
    project(name = 'projectId', minRole: Role = 'viewer'): RequestHandler {
      return async (req, _res, next) => {
        const projectId = parseId(param(name)(req) as string, 'Project');
        const role = await projectAccess(ds, currentUser(req), projectId, minRole);
        req.access = { projectId, role };
        next();
      };
    },
    model(name = 'id', minRole: Role = 'viewer'): RequestHandler {
      return async (req, _res, next) => {
        req.access = await modelAccess(ds, currentUser(req), parseId(param(name)(req) as string, 'Model'), minRole);
        next();
      };
    },
    run(name = 'id', minRole: Role = 'viewer'): RequestHandler {
      return async (req, _res, next) => {
        const { run: _run, ...access } = await runAccess(ds, currentUser(req), parseId(param(name)(req) as string, 'Run'), minRole);
        req.access = access;
        next();
      };
    },
    /** Every run id named in the query (`/api/runs/compare?a=&b=`); ids that are not numbers are left to the handler. */
    runsInQuery(...names: string[]): RequestHandler {
      return async (req, _res, next) => {
        for (const n of names) {
          const raw = req.query[n];
          if (typeof raw === 'string' && /^[1-9][0-9]{0,14}$/.test(raw)) {
            const { run: _run, ...access } = await runAccess(ds, currentUser(req), Number(raw), 'viewer');
            req.access = access;
          }
        }
        next();
      };
    },
  };
}

/** For viewers, a model's `lastRun` is shown only when that run is approved (else null). */
export async function forViewer<T extends { lastRun: { id: number } | null }>(ds: DataSource, role: Role, models: T[]): Promise<T[]> {
  if (role !== 'viewer') return models;
  const repo = ds.getRepository(RunEntity);
  const out: T[] = [];
  for (const m of models) {
    const run = m.lastRun ? await repo.findOne({ where: { id: m.lastRun.id }, select: { id: true, reviewStatus: true } }) : null;
    out.push(run && run.reviewStatus === 'approved' ? m : { ...m, lastRun: null });
  }
  return out;
}
