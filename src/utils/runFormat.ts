/** Run display helpers: phases, durations. */
import { RUN_PHASES, type RunPhase } from '../../shared/schemas/runs.js';

const PHASE_LABELS: Record<RunPhase, string> = {
  reading: 'Reading the model',
  assembling: 'Assembling stiffness',
  factorising: 'Factorising',
  solving: 'Solving every loading',
  recovering: 'Member forces',
  checking: 'Design checks',
  saving: 'Saving results',
};

export function phaseLabel(phase: RunPhase | null | undefined): string {
  return phase ? PHASE_LABELS[phase] ?? phase : 'Waiting for a worker';
}

/** Phases with their state relative to the current one. */
export function phaseSteps(phase: RunPhase | null | undefined, status: string): { phase: RunPhase; label: string; state: 'done' | 'active' | 'todo' }[] {
  const at = phase ? RUN_PHASES.indexOf(phase) : -1;
  return RUN_PHASES.map((p, i) => ({
    phase: p,
    label: PHASE_LABELS[p],
    state: status === 'done' || i < at ? 'done' : i === at && status === 'running' ? 'active' : 'todo',
  }));
}

/** 850 → "0.85 s", 75 000 → "1 min 15 s". */
export function formatDuration(ms: number | null | undefined): string {
  if (ms === null || ms === undefined || !Number.isFinite(ms)) return '—';
  if (ms < 1000) return `${(ms / 1000).toFixed(2)} s`;
  if (ms < 60_000) return `${(ms / 1000).toFixed(1)} s`;
  const min = Math.floor(ms / 60_000);
  return `${min} min ${Math.round((ms - min * 60_000) / 1000)} s`;
}

/** What the screen says about a failed run: the server's message (which already says the run failed), or a plain fallback. */
export function runFailureMessage(message: string | null | undefined): string {
  const m = (message ?? '').trim();
  if (!m) return 'The run failed: no reason given';
  return /^the run failed\b/i.test(m) ? m : `The run failed: ${m}`;
}
