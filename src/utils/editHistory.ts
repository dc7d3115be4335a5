/**
 * Undo of grid edits: each step remembers the values a user action replaced (one cell, or
 * every cell of one paste), so Ctrl+Z puts them back in reverse order. Pure.
 */
export interface EditChange<F extends string = string, V = unknown> {
  member: string;
  field: F;
  /** the value shown before the change (a pending value, or the saved one) */
  before: V;
}

export class EditHistory<F extends string = string, V = unknown> {
  private steps: EditChange<F, V>[][] = [];

  constructor(private readonly limit = 200) {}

  /** Records one user action (ignored when empty). */
  push(changes: EditChange<F, V>[]): void {
    if (!changes.length) return;
    this.steps.push(changes);
    if (this.steps.length > this.limit) this.steps.shift();
  }

  /** The last action's changes in the order to restore them (last changed first), or null. */
  pop(): EditChange<F, V>[] | null {
    const step = this.steps.pop();
    return step ? [...step].reverse() : null;
  }

  clear(): void {
    this.steps = [];
  }

  get size(): number {
    return this.steps.length;
  }
}
