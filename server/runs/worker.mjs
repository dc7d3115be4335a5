// Entry of a run worker thread: registers tsx in this thread, then loads the TypeScript body.
// (Loader flags in a Worker's execArgv are not honoured on Node 20, so the worker does it itself.)
import { register } from 'tsx/esm/api';

register();
await import('./worker-main.ts');
