/**
 * Identical exports built once. An export is a pure function of its run's stored results and
 * its header block (project, model, run, review state, approval — nothing about who asks), so
 * when several people ask for the same file of the same run while it is being built (a lead
 * and two engineers downloading the schedule of the run just approved), the later requests
 * join the build in progress: they get the pieces already made, then every further piece as
 * it comes, and the worker builds the file once.
 *
 * The pieces are kept in memory only while the build runs and only up to `maxBufferedBytes`;
 * past that the build stops being shareable and later requests start their own (a 300 MB
 * checks.csv is not held to be shared). Nothing is kept once the build has finished.
 */
export interface SharedBuildStats {
  /** builds started */
  built: number;
  /** requests that joined a build in progress */
  joined: number;
}

interface Build<R> {
  chunks: Uint8Array[];
  bytes: number;
  shareable: boolean;
  followers: Set<(chunk: Uint8Array) => void>;
  done: Promise<R>;
}

/** Default bound of the pieces kept for joiners, per build. */
export const SHARED_EXPORT_MAX_BYTES = 64 * 1024 * 1024;

export class SharedExports {
  private readonly builds = new Map<string, Build<unknown>>();
  readonly stats: SharedBuildStats = { built: 0, joined: 0 };

  constructor(private readonly maxBufferedBytes = SHARED_EXPORT_MAX_BYTES) {}

  /**
   * Runs `build` for `key`, or joins the build of the same key in progress. `onChunk` gets
   * every piece of the file in order either way.
   */
  run<R>(key: string, build: (onChunk: (chunk: Uint8Array) => void) => Promise<R>, onChunk: (chunk: Uint8Array) => void): Promise<R> {
    const current = this.builds.get(key) as Build<R> | undefined;
    if (current?.shareable) {
      this.stats.joined++;
      for (const c of current.chunks) onChunk(c);
      current.followers.add(onChunk);
      return current.done;
    }
    this.stats.built++;
    const entry: Build<R> = { chunks: [], bytes: 0, shareable: true, followers: new Set(), done: undefined as unknown as Promise<R> };
    const forget = () => {
      entry.shareable = false;
      entry.chunks = [];
      if (this.builds.get(key) === entry) this.builds.delete(key);
    };
    entry.done = build((chunk) => {
      onChunk(chunk);
      for (const f of entry.followers) f(chunk);
      if (!entry.shareable) return;
      entry.bytes += chunk.byteLength;
      if (entry.bytes > this.maxBufferedBytes) forget();
      else entry.chunks.push(chunk);
    }).finally(forget);
    this.builds.set(key, entry as Build<unknown>);
    return entry.done;
  }

  /** Builds in progress that can still be joined. */
  get inProgress(): number {
    return this.builds.size;
  }
}

let shared: SharedExports | null = null;
/** This server's shared builds. */
export function sharedExports(): SharedExports {
  shared ??= new SharedExports();
  return shared;
}
