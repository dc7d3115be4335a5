/**
 * Shared parts of our grid cell editors (member fields in the results grid, model tables in
 * the Model tab): the text an editor starts with, and the option list's keyboard movement.
 * Pure, so they are tested without a grid.
 */

/** What the editor starts with: the typed character that opened it, else the cell's value (selected). */
export function startText(params: { eventKey?: string | null; value?: unknown }): { text: string; select: boolean } {
  if (params.eventKey && params.eventKey.length === 1) return { text: params.eventKey, select: false };
  const v = params.value;
  return { text: v === null || v === undefined ? '' : String(v), select: true };
}

/** The highlighted option after an arrow key: -1 is none (the text as typed); wraps at both ends. */
export function moveActive(active: number, count: number, key: 'ArrowDown' | 'ArrowUp'): number {
  if (count <= 0) return -1;
  if (key === 'ArrowDown') return active >= count - 1 ? 0 : active + 1;
  return active <= 0 ? count - 1 : active - 1;
}

export interface EditorOption {
  value: string;
  /** a short tag shown at the right ("in model") */
  tag?: string;
}
