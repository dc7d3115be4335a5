/**
 * Bounded concurrency for reading uploads. At most `concurrency` imports occupy the run
 * worker pool at once (default 1: with the default two workers one is always free for runs),
 * at most `queue` more wait in arrival order; beyond that the upload is refused with 429
 * and Retry-After instead of piling up.
 */
import { AppError } from '../errors/app-error.js';

export class ImportQueue {
  private active = 0;
  private readonly waiting: (() => void)[] = [];

  constructor(
    readonly concurrency: number,
    readonly queue: number,
  ) {}

  /** Runs `task` when a slot is free; 429 when the queue is full. */
  async run<T>(task: () => Promise<T>): Promise<T> {
    if (this.active >= this.concurrency) {
      if (this.waiting.length >= this.queue) {
        throw new AppError(429, 'rate_limited', `The server is reading ${this.active + this.waiting.length} other uploads; try again in a few seconds`, {
          retryAfterSeconds: 5,
        });
      }
      await new Promise<void>((resolve) => this.waiting.push(resolve));
    } else {
      this.active++;
    }
    try {
      return await task();
    } finally {
      const next = this.waiting.shift();
      if (next) next(); // the slot passes on
      else this.active--;
    }
  }

  get load(): { active: number; waiting: number } {
    return { active: this.active, waiting: this.waiting.length };
  }
}
