/**
 * The review workflow: every allowed and forbidden transition, who may take it, viewers'
 * sight of runs, the locks an approval sets, and the e-mails each step sends.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ReviewAction } from '../../../shared/schemas/reviews.js';
import type { ReviewStatus } from '../../../shared/schemas/runs.js';
import { closeMailers } from '../../../server/mail/mailer.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { CSV, importDemo, upload } from '../models/fixture.js';
import { makeTeam, type Team } from '../membership/fixture.js';
import { runInState } from './fixture.js';
import { RunEntity } from '../../../server/runs/run.entity.js';

let t: TestApp;
let team: Team;
let modelId: number;
const idle = () => t.mailIdle();

beforeAll(async () => {
  t = await createTestApp();
  team = await makeTeam(t, 'Review test project');
  modelId = await importDemo(t, team.projectId);
});
afterAll(async () => {
  await closeMailers();
  await t.close();
});

type Actor = 'viewer' | 'engineer' | 'lead' | 'admin' | 'lead2' | 'outLead';
const call = (who: Actor, url: string) => (who === 'lead2' || who === 'outLead' ? team.as(who).post(url) : t.as(who).post(url));
const idOf = (who: 'engineer' | 'lead' | 'admin') => t.users[who]!.id;

interface Case {
  from: ReviewStatus;
  action: ReviewAction;
  actor: Actor;
  submitter: 'engineer' | 'lead' | 'admin';
  expect: number;
  to?: ReviewStatus;
}

const STATES: ReviewStatus[] = ['draft', 'submitted', 'returned', 'approved'];
const ALLOWED_FROM: Record<ReviewAction, ReviewStatus[]> = { submit: ['draft', 'returned'], return: ['submitted'], approve: ['submitted'] };
const TO: Record<ReviewAction, ReviewStatus> = { submit: 'submitted', return: 'returned', approve: 'approved' };

/** The rule being tested (shared/schemas/reviews.ts), written out case by case. */
function expected(from: ReviewStatus, action: ReviewAction, actor: Actor, submitter: Case['submitter']): number {
  if (actor === 'outLead') return 404; // not a member: the run does not exist for them
  const accountCan = action === 'submit' ? actor !== 'viewer' : actor === 'lead' || actor === 'lead2' || actor === 'admin';
  if (!accountCan) return 403;
  if (!ALLOWED_FROM[action].includes(from)) return 409;
  if (action === 'approve' && actor === submitter && actor !== 'admin') return 403;
  return 200;
}

const CASES: Case[] = [];
for (const from of STATES) {
  for (const action of ['submit', 'return', 'approve'] as const) {
    for (const actor of ['viewer', 'engineer', 'lead', 'lead2', 'admin', 'outLead'] as const) {
      const code = expected(from, action, actor, 'engineer');
      CASES.push({ from, action, actor, submitter: 'engineer', expect: code, to: code === 200 ? TO[action] : from });
    }
  }
}
// self-approval: a lead may not approve what they submitted; an admin may
CASES.push({ from: 'submitted', action: 'approve', actor: 'lead', submitter: 'lead', expect: 403, to: 'submitted' });
CASES.push({ from: 'submitted', action: 'approve', actor: 'admin', submitter: 'admin', expect: 200, to: 'approved' });

describe('review transitions', () => {
  it.each(CASES)('$from --$action--> by $actor (submitted by $submitter): $expect', async (c) => {
    const runId = await runInState(t, modelId, c.from, idOf(c.submitter));
    const res = await call(c.actor, `/api/runs/${runId}/review/${c.action}`).send({ message: 'Checked the bracing' });
    expect(res.status).toBe(c.expect);
    const after = await t.as('admin').get(`/api/runs/${runId}/review`);
    expect(after.body.status).toBe(c.to);
    if (c.expect === 200) {
      expect(res.body.events.at(-1)).toMatchObject({ action: c.action, fromStatus: c.from, toStatus: c.to, message: 'Checked the bracing' });
    }
  });

  it('refuses to submit a run that has not finished, and a submit or return without a message', async () => {
    const running = await runInState(t, modelId, 'draft', null, 1, 'running');
    const res = await t.as('engineer').post(`/api/runs/${running}/review/submit`).send({ message: 'please check' });
    expect(res.status).toBe(409);
    expect(res.body.error.message).toMatch(/only a finished run/);
    const draft = await runInState(t, modelId, 'draft', null);
    const empty = await t.as('engineer').post(`/api/runs/${draft}/review/submit`).send({ message: '  ' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.details.fieldErrors.message).toBeDefined();
  });

  it('tells each caller which steps they may take now', async () => {
    const runId = await runInState(t, modelId, 'submitted', idOf('engineer'));
    expect((await t.as('engineer').get(`/api/runs/${runId}/review`)).body.allowed).toEqual([]);
    expect((await t.as('lead').get(`/api/runs/${runId}/review`)).body.allowed).toEqual(['return', 'approve']);
  });
});

describe('what viewers see', () => {
  it('shows viewers approved runs only, in lists and by id', async () => {
    const draft = await runInState(t, modelId, 'draft', null);
    const approved = await runInState(t, modelId, 'approved', idOf('engineer'));
    expect((await t.as('viewer').get(`/api/runs/${draft}`)).status).toBe(404);
    expect((await t.as('viewer').get(`/api/runs/${approved}`)).status).toBe(200);
    const list = (await t.as('viewer').get(`/api/models/${modelId}/runs`)).body as { id: number; reviewStatus: string }[];
    expect(list.length).toBeGreaterThan(0);
    expect(list.every((r) => r.reviewStatus === 'approved')).toBe(true);
    expect((await t.as('engineer').get(`/api/models/${modelId}/runs`)).body.some((r: { id: number }) => r.id === draft)).toBe(true);
  });

  it("hides a model's last run from viewers unless it is approved", async () => {
    const project = await t.as('lead').post('/api/projects').send({ name: 'Viewer sight' });
    const pid = project.body.id as number;
    for (const [email, role] of [['engineer@example.com', 'engineer'], ['viewer@example.com', 'viewer']]) {
      await t.as('lead').post(`/api/projects/${pid}/members`).send({ email, role });
    }
    const mid = await importDemo(t, pid);
    const draft = await runInState(t, mid, 'draft', null);
    // the model list reads its last run from the runs table
    const asViewer = (await t.as('viewer').get(`/api/projects/${pid}/models`)).body as { lastRun: { id: number } | null }[];
    const asEngineer = (await t.as('engineer').get(`/api/projects/${pid}/models`)).body as { lastRun: { id: number } | null }[];
    expect(asEngineer[0]!.lastRun?.id).toBe(draft);
    expect(asViewer[0]!.lastRun).toBeNull();
    expect((await t.as('viewer').get(`/api/models/${mid}`)).body.lastRun).toBeNull();
    await t.dataSource.getRepository(RunEntity).update({ id: draft }, { reviewStatus: 'approved' });
    expect((await t.as('viewer').get(`/api/projects/${pid}/models`)).body[0].lastRun.id).toBe(draft);
  });
});

describe('locks from approval', () => {
  it('locks the approved version: no member edits, no new version by import, no project deletion; a new model is fine', async () => {
    const project = await t.as('lead').post('/api/projects').send({ name: 'Lock test' });
    const pid = project.body.id as number;
    await t.as('lead').post(`/api/projects/${pid}/members`).send({ email: 'engineer@example.com', role: 'engineer' });
    const mid = await importDemo(t, pid);
    await runInState(t, mid, 'approved', idOf('engineer'));

    const edit = await t.as('engineer').patch(`/api/models/${mid}/members`).send({ baseVersion: 1, edits: [{ member: 'M1', field: 'section', value: 'B400' }] });
    expect(edit.status).toBe(423);
    expect(edit.body.error.code).toBe('locked');
    expect(edit.body.error.message).toMatch(/approved .* locked/);

    const preview = await upload(t, pid, CSV, { modelId: String(mid) });
    expect(preview.status).toBe(201);
    const commit = await t.as('engineer').post(`/api/projects/${pid}/imports/${preview.body.id}/commit`).send({});
    expect(commit.status).toBe(423);
    expect((await t.as('engineer').get(`/api/models/${mid}`)).body.currentVersion).toBe(1);

    const del = await t.as('lead').delete(`/api/projects/${pid}`);
    expect(del.status).toBe(423);
    expect((await t.as('lead').get(`/api/projects/${pid}`)).status).toBe(200);

    expect(await importDemo(t, pid)).toBeGreaterThan(mid);
  });

  it('leaves a model editable while its runs are only submitted or returned', async () => {
    const project = await t.as('lead').post('/api/projects').send({ name: 'Unlocked' });
    const pid = project.body.id as number;
    await t.as('lead').post(`/api/projects/${pid}/members`).send({ email: 'engineer@example.com', role: 'engineer' });
    const mid = await importDemo(t, pid);
    await runInState(t, mid, 'returned', idOf('engineer'));
    const edit = await t.as('engineer').patch(`/api/models/${mid}/members`).send({ baseVersion: 1, edits: [{ member: 'M1', field: 'section', value: 'B400' }] });
    expect(edit.status).toBe(200);
  });
});

describe('review e-mails (captured by the fake SMTP server)', () => {
  interface Msg { to: string[]; subject: string; text: string; html: string; kind: string }
  const outbox = async (): Promise<Msg[]> => {
    await idle();
    return (await t.as('admin').get('/api/outbox')).body as Msg[];
  };

  it('mails the project leads on submit, and the submitter on return and on approval', async () => {
    const runId = await runInState(t, modelId, 'draft', null);
    const before = (await outbox()).length;
    await t.as('engineer').post(`/api/runs/${runId}/review/submit`).send({ message: 'Ready <for> review & sign-off' });
    let mail = await outbox();
    expect(mail.length).toBe(before + 1);
    expect(mail[0]!.kind).toBe('submitted');
    expect([...mail[0]!.to].sort()).toEqual(['lead@example.com', team.users.lead2.email].sort());
    expect(mail[0]!.subject).toBe(`Review requested: run ${runId} of Two-span demo beam`);
    expect(mail[0]!.text).toContain('Ready <for> review & sign-off');
    expect(mail[0]!.text).toContain(`/runs/${runId}`);
    expect(mail[0]!.html).toContain('Ready &lt;for&gt; review &amp; sign-off');

    await t.as('lead').post(`/api/runs/${runId}/review/return`).send({ message: 'Check M2 buckling length' });
    mail = await outbox();
    expect(mail[0]).toMatchObject({ kind: 'returned', to: ['engineer@example.com'] });
    expect(mail[0]!.text).toContain('Check M2 buckling length');

    await t.as('engineer').post(`/api/runs/${runId}/review/submit`).send({ message: 'Fixed' });
    await team.as('lead2').post(`/api/runs/${runId}/review/approve`).send({ message: 'Good' });
    mail = await outbox();
    expect(mail[0]).toMatchObject({ kind: 'approved', to: ['engineer@example.com'] });
    expect(mail[0]!.subject).toBe(`Approved: run ${runId} of Two-span demo beam`);
  });

  it('shows non-admins only the messages addressed to them', async () => {
    const engineerMail = (await t.as('engineer').get('/api/outbox')).body as Msg[];
    expect(engineerMail.length).toBeGreaterThan(0);
    expect(engineerMail.every((m) => m.to.includes('engineer@example.com'))).toBe(true);
    const leadMail = (await t.as('lead').get('/api/outbox')).body as Msg[];
    expect(leadMail.every((m) => m.to.includes('lead@example.com'))).toBe(true);
  });
});
