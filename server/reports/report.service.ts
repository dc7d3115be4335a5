/**
 * Calculation packages: a job per request. The HTTP thread gathers what the package shows (stored
 * run, model, review history; each chosen member's station forces and check records from the run
 * worker pool, as the member page gets them), then a report worker lays out the PDF and posts its
 * chunks, which are kept with the job and streamed to whoever downloads it. Jobs live for
 * REPORT_TTL_MS after they finish; anyone who may read the run may read its jobs (the router's
 * run guard decides; job ids are random UUIDs). Scaled mode (QUEUE_URL): the job is also
 * copied to Redis as it goes (report-store.ts), and a server that did not start it answers
 * progress and download from there.
 */
import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { Worker } from 'node:worker_threads';
import type { DataSource } from 'typeorm';
import type { MemberUtilisation } from '../../shared/design/types.js';
import type { Model } from '../../shared/model/types.js';
import type { ReportJob, StartReportInput } from '../../shared/schemas/reports.js';
import type { Logger } from '../config/logger.js';
import { AppError, notFound } from '../errors/app-error.js';
import { findModel } from '../models/model.service.js';
import { findProject } from '../projects/project.service.js';
import { RunReviewEntity } from '../reviews/review.entity.js';
import { doneRun, loadingKey, loadingsOf, membersOf, runModel, stabilityOf } from '../runs/run.service.js';
import type { RunRecord } from '../runs/run.entity.js';
import { runPool } from '../runs/worker-pool.js';
import { UserEntity } from '../users/user.entity.js';
import type { ReportCover, ReportData, ReportMember } from './report-data.js';
import type { ReportReply, ReportRequest } from './report-worker-protocol.js';
import { POLL_MS, ReportMirror, readChunks, readState, sharedReports } from './report-store.js';

/** Most member records one package holds. */
export const MAX_REPORT_MEMBERS = 2000;
export const REPORT_TTL_MS = 15 * 60_000;

interface Job extends ReportJob {
  userId: number;
  chunks: Uint8Array[];
  listeners: Set<() => void>;
  worker?: Worker;
  expires?: NodeJS.Timeout;
  /** scaled mode: its copy in Redis */
  mirror?: ReportMirror;
}

const jobs = new Map<string, Job>();

function publicJob(j: Job): ReportJob {
  return { id: j.id, runId: j.runId, phase: j.phase, done: j.done, total: j.total, pages: j.pages, message: j.message, fileName: j.fileName };
}

function notify(j: Job): void {
  j.mirror?.state(publicJob(j));
  for (const l of [...j.listeners]) l();
}

function settle(j: Job, phase: 'done' | 'failed', message: string): void {
  j.phase = phase;
  j.message = message;
  j.worker = undefined;
  j.expires = setTimeout(() => jobs.delete(j.id), REPORT_TTL_MS);
  j.expires.unref();
  notify(j);
}

let softwareVersion: string | null = null;
function software(): string {
  if (!softwareVersion) {
    const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version: string };
    softwareVersion = `Trestle ${pkg.version}`;
  }
  return softwareVersion;
}

const stamp = (d: Date) => `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;
const safeName = (t: string) => t.replace(/[^A-Za-z0-9._-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60) || 'model';
const ACTION_WORDS: Record<string, string> = { submit: 'submitted', return: 'returned', approve: 'approved' };

function inputCounts(model: Model): [string, number][] {
  return [
    ['nodes', model.nodes.length], ['supports', model.supports.length], ['materials', model.materials.length],
    ['sections', model.sections.length], ['members', model.members.length], ['load cases', model.cases.length],
    ['node loads', model.nodeLoads.length], ['member loads', model.memberLoads.length], ['settlements', model.settlements.length],
    ['combinations (in force)', model.combinations.length], ['vehicle axles', model.vehicles.length], ['lane members', model.lanes.length],
    ['moving loads', model.movingLoads.length], ['result points', model.resultPoints.length],
  ];
}

function settingsRows(model: Model): [string, string][] {
  return Object.entries(model.settings)
    .filter(([, v]) => v !== undefined && v !== null && typeof v !== 'object')
    .map(([k, v]) => [k, String(v)]);
}

function choose(members: MemberUtilisation[], input: StartReportInput): { chosen: MemberUtilisation[]; label: string } {
  if (input.members === 'all') return { chosen: members, label: `all members (${members.length})` };
  if (input.members === 'failing') {
    const chosen = members.filter((m) => m.status === 'fail');
    return { chosen, label: `failing members (${chosen.length})` };
  }
  const byId = new Map(members.map((m) => [m.member, m]));
  const missing = input.members.filter((id) => !byId.has(id));
  if (missing.length) throw new AppError(400, 'bad_request', `members: ${missing.slice(0, 5).join(', ')} ${missing.length === 1 ? 'is' : 'are'} not in this run`);
  const wanted = new Set(input.members);
  const chosen = members.filter((m) => wanted.has(m.member));
  return { chosen, label: `selected members (${chosen.length})` };
}

async function coverOf(ds: DataSource, run: RunRecord, model: Model, members: MemberUtilisation[], selection: string): Promise<ReportCover> {
  const modelRow = await findModel(ds, run.modelId);
  const project = await findProject(ds, modelRow.projectId);
  const reviews = await ds.getRepository(RunReviewEntity).find({ where: { runId: run.id }, order: { id: 'ASC' } });
  const ids = [...new Set([run.createdBy, ...reviews.map((r) => r.userId)].filter((id): id is number => id !== null))];
  const users = ids.length ? await ds.getRepository(UserEntity).findBy(ids.map((id) => ({ id }))) : [];
  const name = (id: number | null) => (id === null ? 'unknown' : (users.find((u) => u.id === id)?.name ?? `user ${id}`));
  const s = stabilityOf(run);
  const settings = JSON.parse(run.settingsJson) as { analysis?: string };
  return {
    project: project.name,
    model: modelRow.name,
    version: run.version,
    run: run.id,
    designCode: run.designCode,
    analysis: s?.analysis ?? settings.analysis ?? 'first_order',
    method: s?.method ?? 'first-order elastic',
    units: model.settings.units,
    reviewStatus: run.reviewStatus,
    ranBy: name(run.createdBy),
    ranAt: stamp(run.finishedAt ?? run.createdAt),
    review: reviews.map((r) => ({ action: ACTION_WORDS[r.action] ?? r.action, by: name(r.userId), at: stamp(r.createdAt), message: r.message })),
    software: software(),
    generatedAt: stamp(new Date()),
    counts: { pass: run.passCount ?? 0, fail: run.failCount ?? 0, notChecked: run.notCheckedCount ?? 0 },
    maxRatio: run.maxRatio,
    selection,
  };
}

/** Starts a package; answers at once with the job (poll it, then download the file). */
export async function startReport(ds: DataSource, logger: Logger, userId: number, runId: number, input: StartReportInput, compress = true): Promise<ReportJob> {
  const { run, result } = await doneRun(ds, runId);
  const members = membersOf(result);
  const { chosen, label } = choose(members, input);
  if (chosen.length > MAX_REPORT_MEMBERS) {
    throw new AppError(413, 'payload_too_large', `A package holds at most ${MAX_REPORT_MEMBERS} member records; ${chosen.length} were chosen — choose failing or selected members`);
  }
  const { model, json } = await runModel(ds, run);
  const cover = await coverOf(ds, run, model, members, label);
  const modelName = (await findModel(ds, run.modelId)).name;
  const job: Job = {
    id: randomUUID(), runId, phase: 'gathering', done: 0, total: chosen.length, pages: null, message: '',
    fileName: `${safeName(modelName)}-v${run.version}-run${run.id}-calculation-package.pdf`,
    userId, chunks: [], listeners: new Set(),
  };
  jobs.set(job.id, job);
  if (sharedReports()) {
    // readable on every server before the answer leaves
    job.mirror = new ReportMirror(job.id, REPORT_TTL_MS);
    job.mirror.state(publicJob(job));
    await job.mirror.flush();
  }
  void produce(job, run, json, model, result, members, chosen, cover, compress).catch((err: unknown) => {
    const known = err instanceof AppError;
    if (!known) logger.error(`calculation package ${job.id} of run ${runId} failed`, err);
    settle(job, 'failed', known ? err.message : 'The package could not be written; try again, and report it if it keeps failing');
  });
  return publicJob(job);
}

async function produce(
  job: Job, run: RunRecord, json: string, model: Model, result: Parameters<typeof loadingsOf>[0],
  members: MemberUtilisation[], chosen: MemberUtilisation[], cover: ReportCover, compress: boolean,
): Promise<void> {
  const loadings = loadingsOf(result);
  const firstCombo = Math.max(0, loadings.findIndex((l) => l.kind === 'combination'));
  const records: ReportMember[] = [];
  for (const util of chosen) {
    const index = model.members.findIndex((m) => m.id === util.member);
    // the governing loading, chosen as the member page chooses it (server/runs/run.service.ts getMemberDetail)
    const governing = loadings.findIndex((l) => l.id === util.combination && l.kind === 'combination' && (!util.envelope || !l.envelope || l.envelope === util.envelope));
    const loading = governing >= 0 ? governing : firstCombo;
    const detail = await runPool().run({ kind: 'member', runId: run.id, modelJson: json, designCode: run.designCode, member: index, loading, governing });
    records.push({ util, loading: loadings[loading] ? loadingKey(loadings[loading]) : '', stations: detail.stations, records: detail.governingRecords });
    job.done += 1;
    notify(job);
  }
  const data: ReportData = { cover, inputCounts: inputCounts(model), settings: settingsRows(model), schedule: members, members: records };
  job.phase = 'writing';
  job.done = 0;
  notify(job);
  await write(job, { data, compress });
}

function write(job: Job, request: ReportRequest): Promise<void> {
  return new Promise((resolve, reject) => {
    const worker = new Worker(new URL('./report-worker.mjs', import.meta.url), { workerData: request });
    job.worker = worker;
    worker.unref();
    let settled = false;
    worker.on('message', (reply: ReportReply) => {
      if (reply.type === 'chunk') {
        job.chunks.push(reply.chunk);
        job.mirror?.chunk(reply.chunk);
        notify(job);
      } else if (reply.type === 'progress') {
        job.done = reply.done;
        notify(job);
      } else if (reply.type === 'done') {
        settled = true;
        job.pages = reply.pages;
        job.done = job.total;
        settle(job, 'done', `${reply.pages} pages`);
        resolve();
      } else {
        settled = true;
        reject(new Error(reply.message));
      }
    });
    worker.on('error', (err) => {
      if (!settled) reject(err);
      settled = true;
    });
    worker.on('exit', (code) => {
      if (!settled) reject(new Error(`report worker stopped (exit code ${code})`));
      settled = true;
    });
  });
}

function jobOf(runId: number, id: string): Job {
  const job = jobs.get(id);
  if (!job || job.runId !== runId) throw notFound(`No calculation package ${id} for run ${runId}`);
  return job;
}

/** A job this server started, or (scaled mode) its state as another server left it in Redis. */
async function findJob(runId: number, id: string): Promise<{ local: Job } | { shared: ReportJob }> {
  const local = jobs.get(id);
  if (local || !sharedReports()) return { local: jobOf(runId, id) };
  const shared = await readState(id);
  if (!shared || shared.runId !== runId) throw notFound(`No calculation package ${id} for run ${runId}`);
  return { shared };
}

export async function getReport(runId: number, id: string): Promise<ReportJob> {
  const found = await findJob(runId, id);
  return 'local' in found ? publicJob(found.local) : found.shared;
}

/** The file's chunks as they come: what is written so far, then each new chunk until the end. */
export async function* reportChunks(runId: number, id: string): AsyncGenerator<Uint8Array> {
  const found = await findJob(runId, id);
  if ('shared' in found) {
    yield* sharedChunks(runId, id);
    return;
  }
  const job = found.local;
  if (job.phase === 'failed') throw new AppError(409, 'conflict', job.message);
  let sent = 0;
  for (;;) {
    while (sent < job.chunks.length) yield job.chunks[sent++];
    const phase = job.phase as ReportJob['phase']; // changes while we wait
    if (phase === 'done') return;
    if (phase === 'failed') throw new AppError(409, 'conflict', job.message);
    await new Promise<void>((resolve) => {
      const wake = () => {
        job.listeners.delete(wake);
        resolve();
      };
      job.listeners.add(wake);
    });
  }
}

/** Another server's job, from Redis: its state first, then the chunks (written before any state that follows them). */
async function* sharedChunks(runId: number, id: string): AsyncGenerator<Uint8Array> {
  let sent = 0;
  for (;;) {
    const state = await readState(id);
    if (!state || state.runId !== runId) throw new AppError(409, 'conflict', 'The calculation package is no longer available (its server stopped or it expired); start it again');
    if (state.phase === 'failed') throw new AppError(409, 'conflict', state.message);
    const chunks = await readChunks(id, sent);
    for (const c of chunks) {
      sent++;
      yield new Uint8Array(c.buffer, c.byteOffset, c.byteLength);
    }
    if (state.phase === 'done') return;
    await new Promise((r) => setTimeout(r, POLL_MS));
  }
}

/** The job's file name, once it has not failed (for the download headers). */
export async function reportFileName(runId: number, id: string): Promise<string> {
  const found = await findJob(runId, id);
  const job = 'local' in found ? publicJob(found.local) : found.shared;
  if (job.phase === 'failed') throw new AppError(409, 'conflict', job.message);
  return job.fileName;
}

/** Whether the package is written (tests wait for it). */
export function reportSettled(id: string): Promise<void> {
  const job = jobs.get(id);
  if (!job) return Promise.resolve();
  return new Promise((resolve) => {
    const check = () => {
      if (job.phase === 'done' || job.phase === 'failed') {
        job.listeners.delete(check);
        resolve();
      }
    };
    job.listeners.add(check);
    check();
  });
}
