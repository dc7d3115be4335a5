/**
 * A prompt before unsaved grid edits are lost: the browser's own prompt when the tab is closed
 * or reloaded (beforeunload), and a confirmation before the router leaves the page. Routes that
 * keep the edits (`keeps`, e.g. the member page of the same model) pass without asking.
 */
import { onBeforeUnmount, onMounted } from 'vue';
import { onBeforeRouteLeave, onBeforeRouteUpdate, type RouteLocationNormalized } from 'vue-router';

/** The few browser calls used here, typed locally (tests type-check this file without the DOM library). */
interface UnloadEvent {
  preventDefault(): void;
  returnValue: unknown;
}
interface BrowserWindow {
  confirm(message: string): boolean;
  addEventListener(type: 'beforeunload', listener: (e: UnloadEvent) => void): void;
  removeEventListener(type: 'beforeunload', listener: (e: UnloadEvent) => void): void;
}
const browserWindow = (): BrowserWindow => globalThis as unknown as BrowserWindow;

export interface UnsavedGuardOptions {
  /** how many unsaved edits there are (0: nothing to lose) */
  count: () => number;
  /** routes that keep the edits (no prompt) */
  keeps?: (to: RouteLocationNormalized, from: RouteLocationNormalized) => boolean;
  /** what to do when the user agrees to leave (drop the edits) */
  discard?: () => void;
  /** the question (defaults to one naming the count) */
  confirm?: (message: string) => boolean;
}

export function leaveQuestion(count: number): string {
  return `You have ${count} unsaved edit${count === 1 ? '' : 's'} in this model. Leave the page and discard ${count === 1 ? 'it' : 'them'}?`;
}

/** True when the navigation may go ahead (asks when edits would be lost). */
export function mayLeave(o: UnsavedGuardOptions, to: RouteLocationNormalized, from: RouteLocationNormalized): boolean {
  const n = o.count();
  if (n === 0 || o.keeps?.(to, from)) return true;
  const ask = o.confirm ?? ((m: string) => browserWindow().confirm(m));
  if (!ask(leaveQuestion(n))) return false;
  o.discard?.();
  return true;
}

export function useUnsavedGuard(o: UnsavedGuardOptions): void {
  const onBeforeUnload = (e: UnloadEvent): void => {
    if (o.count() === 0) return;
    e.preventDefault();
    e.returnValue = ''; // older browsers need a value to show their prompt
  };
  onMounted(() => browserWindow().addEventListener('beforeunload', onBeforeUnload));
  onBeforeUnmount(() => browserWindow().removeEventListener('beforeunload', onBeforeUnload));
  onBeforeRouteLeave((to, from) => mayLeave(o, to, from));
  // the same page for another model (params change) loses the edits too; a query change (tab) does not
  onBeforeRouteUpdate((to, from) => (to.path === from.path ? true : mayLeave(o, to, from)));
}
