/** Body of a report worker: lays out one calculation package, posting its chunks as they come. */
import { parentPort, workerData } from 'node:worker_threads';
import { buildReportPdf } from './report-pdf.js';
import type { ReportReply, ReportRequest } from './report-worker-protocol.js';

if (!parentPort) throw new Error('report-worker-main.ts must run in a worker thread');
const port = parentPort;
const { data, compress } = workerData as ReportRequest;

const post = (reply: ReportReply, transfer: ArrayBuffer[] = []) => port.postMessage(reply, transfer);

try {
  const pages = await buildReportPdf(data, {
    compress,
    sink: (chunk) => {
      const copy = chunk.slice();
      post({ type: 'chunk', chunk: copy }, [copy.buffer as ArrayBuffer]);
    },
    onProgress: (done, total) => post({ type: 'progress', done, total }),
  });
  post({ type: 'done', pages });
} catch (err) {
  post({ type: 'error', message: err instanceof Error ? err.message : String(err) });
}
