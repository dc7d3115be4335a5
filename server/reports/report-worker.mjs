// Entry of a report worker thread: registers tsx in this thread, then loads the TypeScript body
// (as server/runs/worker.mjs does; Node 20 ignores loader flags in a Worker's execArgv).
import { register } from 'tsx/esm/api';

register();
await import('./report-worker-main.ts');
