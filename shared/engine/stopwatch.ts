/**
 * Phase timings of an analysis: wall milliseconds into the result's diagnostics, and, when a
 * caller passes a second clock (the benchmark passes CPU time), finer phases into its record.
 */
export interface PhaseClock {
  /** milliseconds */
  now: () => number;
  /** phase → milliseconds, accumulated */
  timings: Record<string, number>;
}

export class Stopwatch {
  private t = performance.now();
  private c: number;

  constructor(readonly timings: Record<string, number>, readonly extra?: PhaseClock) {
    this.c = extra ? extra.now() : 0;
  }

  /** Time since the previous mark under `name` (wall into timings when `wall`); returns the wall milliseconds. */
  lap(name: string, wall = true): number {
    const t = performance.now(), d = t - this.t;
    this.t = t;
    if (wall) this.timings[name] = (this.timings[name] ?? 0) + d;
    this.mark(name);
    return d;
  }

  /** Only the second clock: a finer phase that the diagnostics do not list. */
  fine(name: string): void {
    this.mark(name);
  }

  private mark(name: string): void {
    const x = this.extra;
    if (!x) return;
    const c = x.now();
    x.timings[name] = (x.timings[name] ?? 0) + (c - this.c);
    this.c = c;
  }
}
