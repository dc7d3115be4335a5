/**
 * Collecting garbage on purpose in a worker thread. After a long task — a run of a big model
 * (its factorisations), a re-analysis, a large export — the memory it left is garbage, but
 * V8 collects it only when it next needs room, so the process would keep gigabytes it no longer
 * uses while it serves. A full collection right after such a task returns it (WebAssembly
 * memories and typed arrays included) for a fraction of a second of the thread's time.
 */
import v8 from 'node:v8';
import vm from 'node:vm';

/** Tasks that took longer than this are followed by a collection. */
export const COLLECT_AFTER_MS = 1000;

/** V8's `gc`, exposed for this process (null where the runtime refuses). */
export function exposedGc(): (() => void) | null {
  try {
    v8.setFlagsFromString('--expose_gc');
    const gc = vm.runInNewContext('gc') as unknown;
    return typeof gc === 'function' ? (gc as () => void) : null;
  } catch {
    return null;
  }
}
