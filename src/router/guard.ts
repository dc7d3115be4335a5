/** The navigation rule, as a pure function so it can be tested without a router. */
import { hasRoleAtLeast, type Role, type User } from '../../shared/schemas/users.js';

export interface GuardTarget {
  name?: string | symbol | null;
  fullPath: string;
  meta: { public?: boolean; minRole?: Role };
  query?: Record<string, unknown>;
}

export type GuardDecision =
  | { kind: 'allow' }
  | { kind: 'redirect'; to: { name: string; query?: Record<string, string> } | string };

export const SIGN_IN = 'sign-in';
export const HOME = 'projects';
export const FORBIDDEN = 'forbidden';

/** A redirect target from the query, accepted only when it is a path on this site. */
export function safeRedirect(value: unknown): string | null {
  const v = Array.isArray(value) ? value[0] : value;
  if (typeof v !== 'string') return null;
  if (!v.startsWith('/') || v.startsWith('//') || v.startsWith('/\\')) return null;
  return v;
}

/**
 * Signed-out users go to sign-in (remembering where they were going); a signed-in user
 * visiting sign-in goes on to the remembered page; role-gated pages need the role.
 */
export function decideNavigation(to: GuardTarget, user: User | null): GuardDecision {
  if (to.name === SIGN_IN) {
    if (!user) return { kind: 'allow' };
    return { kind: 'redirect', to: safeRedirect(to.query?.redirect) ?? { name: HOME } };
  }
  if (to.meta.public) return { kind: 'allow' };
  if (!user) {
    const query = to.fullPath && to.fullPath !== '/' ? { redirect: to.fullPath } : undefined;
    return { kind: 'redirect', to: query ? { name: SIGN_IN, query } : { name: SIGN_IN } };
  }
  if (to.meta.minRole && !hasRoleAtLeast(user.role, to.meta.minRole)) {
    return { kind: 'redirect', to: { name: FORBIDDEN } };
  }
  return { kind: 'allow' };
}
