/** Hostile uploads (issue 12, items 3 and 4): refused early and by name, problems capped, reads bounded. */
import { request as httpRequest } from 'node:http';
import type { AddressInfo } from 'node:net';
import ExcelJS from 'exceljs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { xlsxBomb } from '../../../bench/xlsx-bomb.js';
import { ImportQueue } from '../../../server/imports/import-queue.js';
import { closeRunPool } from '../../../server/runs/worker-pool.js';
import { createTestApp, type TestApp } from '../helpers/test-app.js';
import { CSV, newProject, upload, withFile } from '../models/fixture.js';

const ENV = {
  IMPORT_MAX_MB: '0.5',
  IMPORT_MAX_REQUEST_MB: '0.6',
  IMPORT_MAX_UNCOMPRESSED_MB: '64',
  IMPORT_MAX_COLUMNS: '6',
};

let t: TestApp;
let projectId: number;
beforeAll(async () => {
  Object.assign(process.env, ENV);
  t = await createTestApp();
  for (const k of Object.keys(ENV)) delete process.env[k];
  projectId = await newProject(t);
}, 120_000);
afterAll(async () => {
  await closeRunPool();
  await t.close();
});

function uploadBytes(name: string, bytes: Uint8Array) {
  return t.as('engineer').post(`/api/projects/${projectId}/imports`).attach('files', Buffer.from(bytes), name);
}

async function demoWorkbook(): Promise<Uint8Array> {
  const wb = new ExcelJS.Workbook();
  for (const [file, text] of Object.entries(CSV)) {
    const ws = wb.addWorksheet(file.replace('.csv', ''));
    for (const line of text.trim().split('\n')) ws.addRow(line.split(',').map((c) => (c !== '' && !Number.isNaN(Number(c)) ? Number(c) : c)));
  }
  return new Uint8Array(await wb.xlsx.writeBuffer());
}

describe('bounded imports', () => {
  it('refuses the cell bomb with 413 from its zip directory, within a second', async () => {
    const bomb = xlsxBomb(500, 16384); // 117 MB of sheet XML in well under 1 MB
    const t0 = performance.now();
    const res = await uploadBytes('bomb.xlsx', bomb);
    expect(performance.now() - t0).toBeLessThan(1000);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
    expect(res.body.error.message).toMatch(/^bomb\.xlsx: the workbook is over the size limit: it unpacks to 117\.\d MB; at most 64 MB are read \(IMPORT_MAX_UNCOMPRESSED_MB\)$/);
  }, 60_000);

  it('refuses, while reading in the worker, a workbook over the column limit, naming sheet, column and variable', async () => {
    const res = await uploadBytes('demo.xlsx', await demoWorkbook());
    expect(res.status).toBe(413);
    expect(res.body.error.message).toBe(
      'demo.xlsx: the workbook is over the column limit: sheet materials has a cell in column G (row 1); at most 6 columns are read (IMPORT_MAX_COLUMNS)',
    );
  });

  it('limits the whole request, not only each file', async () => {
    const big = 'x'.repeat(350 * 1024);
    const res = await upload(t, projectId, { 'a.csv': big, 'b.csv': big });
    expect(res.status).toBe(413);
    expect(res.body.error.message).toBe('The upload is larger than the 615 kB limit per upload (IMPORT_MAX_REQUEST_MB)');
  });

  it('lists the first 1,000 problems and counts them all by table and column', async () => {
    const rows = Array.from({ length: 1500 }, (_, i) => `X${i},N1,N99,B300,Steel355`).join('\n');
    const res = await upload(t, projectId, withFile('members.csv', `member,start,end,section,material\n${rows}\n`));
    expect(res.status).toBe(201);
    expect(res.body.problems).toHaveLength(1000);
    expect(res.body.problemsTruncated).toBe(true);
    expect(res.body.errorCount).toBe(1504); // and the demo's four member loads on M1 and M2, now missing
    expect(res.body.problemCounts).toContainEqual({ table: 'members', column: 'end', errors: 1500, warnings: 0 });
    const stored = await t.as('engineer').get(`/api/projects/${projectId}/imports/${res.body.id}`);
    expect(stored.body.problems).toHaveLength(1000);
  }, 60_000);
});

describe('per-request size without Content-Length', () => {
  it('counts a chunked upload as it arrives and refuses it with 413 once over the limit', async () => {
    const server = t.app.listen(0, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
    const { port } = server.address() as AddressInfo;
    const boundary = 'xxBOUNDARYxx';
    const part = (name: string) => `--${boundary}\r\nContent-Disposition: form-data; name="files"; filename="${name}"\r\nContent-Type: text/csv\r\n\r\n${'x'.repeat(300 * 1024)}\r\n`;
    try {
      const res = await new Promise<{ status: number; body: string }>((resolve, reject) => {
        const req = httpRequest(
          {
            host: '127.0.0.1',
            port,
            method: 'POST',
            path: `/api/projects/${projectId}/imports`,
            headers: { Cookie: t.cookieFor('engineer'), 'Content-Type': `multipart/form-data; boundary=${boundary}`, 'Transfer-Encoding': 'chunked' },
          },
          (r) => {
            let body = '';
            r.on('data', (c) => (body += c)).on('end', () => resolve({ status: r.statusCode ?? 0, body }));
          },
        );
        req.on('error', reject);
        for (const name of ['a.csv', 'b.csv', 'c.csv']) req.write(part(name));
        req.end(`--${boundary}--\r\n`);
      });
      expect(res.status).toBe(413);
      expect(JSON.parse(res.body).error.message).toBe('The upload is larger than the 615 kB limit per upload (IMPORT_MAX_REQUEST_MB)');
    } finally {
      server.close();
    }
  });
});

describe('clean refusals in uploaded tables', () => {
  it('gives one error where an unclosed CSV quote opens, not follow-on errors', async () => {
    const res = await upload(t, projectId, withFile('nodes.csv', 'node,x [m],y [m]\nN1,0,0\nN2,"6,0\nN3,12,0\n'));
    expect(res.status).toBe(201);
    expect(res.body.problems).toEqual([
      {
        severity: 'error',
        table: 'nodes',
        row: 3,
        column: 'x [m]',
        message: 'a quote (") opens here and is never closed, so the rest of nodes.csv cannot be read: close the quote or remove it',
      },
    ]);
  });

  it('reads a UTF-16 CSV with its byte-order mark and refuses one without it by name', async () => {
    const utf16 = (text: string, bom: boolean) => Buffer.concat([bom ? Buffer.from([0xff, 0xfe]) : Buffer.alloc(0), Buffer.from(text, 'utf16le')]);
    let req = t.as('engineer').post(`/api/projects/${projectId}/imports`);
    for (const [name, text] of Object.entries(CSV)) req = req.attach('files', name === 'nodes.csv' ? utf16(text, true) : Buffer.from(text), name);
    const ok = await req;
    expect(ok.status).toBe(201);
    expect(ok.body.canCommit).toBe(true);
    req = t.as('engineer').post(`/api/projects/${projectId}/imports`);
    for (const [name, text] of Object.entries(CSV)) req = req.attach('files', name === 'nodes.csv' ? utf16(text, false) : Buffer.from(text), name);
    const refused = await req;
    expect(refused.body.problems).toEqual([
      {
        severity: 'error',
        table: 'nodes',
        message: 'nodes.csv is not UTF-8 text (it holds NUL bytes, as UTF-16 without a byte-order mark does): save it as "CSV UTF-8"',
      },
    ]);
  });

  it('refuses ids over 64 characters and ids with control or bidirectional-override characters, with their row', async () => {
    const long = `M${'1'.repeat(64)}`;
    const res = await upload(t, projectId, withFile('members.csv', `member,start,end,section,material\n${long},N1,N2,B300,Steel355\nM\u202Egpj,N2,N3,B300,Steel355\n`));
    const errors = res.body.problems.filter((p: { severity: string }) => p.severity === 'error');
    expect(errors).toContainEqual({ severity: 'error', table: 'members', row: 2, column: 'member', message: 'member is 65 characters long; ids are at most 64' });
    expect(errors).toContainEqual({
      severity: 'error',
      table: 'members',
      row: 3,
      column: 'member',
      message: 'member holds a control or text-direction character (U+202E); ids are plain text',
    });
  });
});

describe('import queue', () => {
  it('runs at most `concurrency` reads at once, queues `queue` more and refuses the rest with 429', async () => {
    const q = new ImportQueue(1, 1);
    let release!: () => void;
    const gate = new Promise<void>((r) => (release = r));
    let running = 0;
    let most = 0;
    const task = async () => {
      most = Math.max(most, ++running);
      await gate;
      running--;
      return 'read';
    };
    const first = q.run(task);
    const second = q.run(task);
    await expect(q.run(task)).rejects.toMatchObject({ status: 429, code: 'rate_limited', details: { retryAfterSeconds: 5 } });
    expect(q.load).toEqual({ active: 1, waiting: 1 });
    release();
    expect(await Promise.all([first, second])).toEqual(['read', 'read']);
    expect(most).toBe(1);
    expect(q.load).toEqual({ active: 0, waiting: 0 });
  });
});
