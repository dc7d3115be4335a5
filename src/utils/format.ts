/** Pure display helpers: labels, dates and error text. Tested without mounting anything. */
import type { DesignCode, UnitSystem } from '../../shared/model/types.js';
import type { Role } from '../../shared/schemas/users.js';

const DESIGN_CODE_LABELS: Record<DesignCode, string> = {
  'aisc360-lrfd': 'AISC 360-22 (LRFD)',
  'aisc360-asd': 'AISC 360-22 (ASD)',
  'en1993-1-1': 'EN 1993-1-1',
  none: 'No design checks',
};

const UNIT_LABELS: Record<UnitSystem, string> = {
  metric: 'Metric (kN, m, MPa)',
  us: 'US customary (kip, ft, ksi)',
};

const ROLE_LABELS: Record<Role, string> = {
  admin: 'Administrator',
  lead: 'Lead',
  engineer: 'Engineer',
  viewer: 'Viewer',
};

export function designCodeLabel(code: DesignCode): string {
  return DESIGN_CODE_LABELS[code] ?? code;
}

export function unitsLabel(units: UnitSystem): string {
  return UNIT_LABELS[units] ?? units;
}

export function roleLabel(role: Role): string {
  return ROLE_LABELS[role] ?? role;
}

/** Items for a v-select: `{ title, value }` in the order given. */
export function selectItems<T extends string>(values: readonly T[], label: (v: T) => string): { title: string; value: T }[] {
  return values.map((value) => ({ title: label(value), value }));
}

function pad(n: number): string {
  return String(n).padStart(2, '0');
}

/**
 * An ISO 8601 timestamp as `YYYY-MM-DD HH:MM` in the given time zone offset
 * (minutes east of UTC; defaults to the browser's). '' for an empty or unreadable value.
 */
export function formatDateTime(iso: string | null | undefined, offsetMinutes?: number): string {
  if (!iso) return '';
  const t = Date.parse(iso);
  if (Number.isNaN(t)) return '';
  const offset = offsetMinutes ?? -new Date(t).getTimezoneOffset();
  const d = new Date(t + offset * 60_000);
  return `${d.getUTCFullYear()}-${pad(d.getUTCMonth() + 1)}-${pad(d.getUTCDate())} ${pad(d.getUTCHours())}:${pad(d.getUTCMinutes())}`;
}

/** Up to two initials for an avatar: "Erin Engineer" → "EE", "viewer@example.com" → "V". */
export function initials(nameOrEmail: string): string {
  const base = nameOrEmail.includes('@') && !nameOrEmail.includes(' ') ? nameOrEmail.split('@')[0] : nameOrEmail;
  const words = base.split(/[\s._-]+/).filter(Boolean);
  if (words.length === 0) return '?';
  if (words.length === 1 || nameOrEmail.includes('@')) return words[0][0].toUpperCase();
  return (words[0][0] + words[words.length - 1][0]).toUpperCase();
}

/** The message to show for anything thrown by an API call or a store action. */
export function errorMessage(err: unknown): string {
  if (err && typeof err === 'object' && 'message' in err && typeof (err as { message: unknown }).message === 'string') {
    const msg = (err as { message: string }).message.trim();
    if (msg) return msg;
  }
  return 'Something went wrong. Please try again.';
}

/**
 * Field messages from a `validation_failed` error's details (`{ fieldErrors: { field: [msg] } }`),
 * keyed by field, ready for a text field's `error-messages`. Empty when there are none.
 */
export function fieldErrors(err: unknown): Record<string, string[]> {
  if (!err || typeof err !== 'object' || !('details' in err)) return {};
  const details = (err as { details: unknown }).details;
  if (!details || typeof details !== 'object' || !('fieldErrors' in details)) return {};
  const fe = (details as { fieldErrors: unknown }).fieldErrors;
  if (!fe || typeof fe !== 'object') return {};
  const out: Record<string, string[]> = {};
  for (const [key, value] of Object.entries(fe)) {
    if (Array.isArray(value)) {
      const msgs = value.filter((m): m is string => typeof m === 'string');
      if (msgs.length) out[key] = msgs;
    }
  }
  return out;
}
