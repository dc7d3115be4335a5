/**
 * What the results grid shows when the pointer rests on a combination: its factors, from the
 * model's loadings (GET /api/models/:id). Combinations the analysis added for the code's
 * horizontal forces (shared/stability/load-variants.ts: `ULS2 +X notional`) are shown as their
 * base combination's terms plus the added case at factor 1.0.
 */
export interface LoadingTerms {
  id: string;
  kind: 'case' | 'combination';
  limitState: string | null;
  terms?: { case: string; factor: number }[];
}

/** A factor as written in a combination: at most three decimals, no trailing zeros. */
export function factorText(f: number): string {
  return String(Number(f.toFixed(3)));
}

/** `1.35 × G + 1.5 × Q` (a negative factor reads `− 0.9 × W`). */
export function termsText(terms: readonly { case: string; factor: number }[]): string {
  return terms
    .map((t, i) => {
      const sign = t.factor < 0 ? '−' : '+';
      const body = `${factorText(Math.abs(t.factor))} × ${t.case}`;
      return i === 0 ? (t.factor < 0 ? `− ${body}` : body) : `${sign} ${body}`;
    })
    .join(' ');
}

const VARIANT = /^(.+) ([+-][XYZ]) ([^+-].*)$/;

/**
 * The hover text of a combination id, or null when the loadings do not know it (then the
 * grid shows no tooltip rather than a guess). `@max`/`@min` (moving-load envelopes) are
 * ignored for the look-up.
 */
export function combinationHover(id: string, loadings: readonly LoadingTerms[] | null | undefined): string | null {
  if (!id || !loadings) return null;
  const bare = id.replace(/@(max|min)$/, '');
  const byId = new Map(loadings.map((l) => [l.id, l]));
  const limit = (l: LoadingTerms) => (l.limitState ? ` (${l.limitState})` : '');
  const own = byId.get(bare);
  if (own) {
    if (own.kind === 'case') return `${bare}: load case`;
    return own.terms?.length ? `${bare}${limit(own)} = ${termsText(own.terms)}` : null;
  }
  const m = VARIANT.exec(bare);
  const base = m ? byId.get(m[1]) : undefined;
  if (m && base?.kind === 'combination' && base.terms?.length) {
    return `${bare}${limit(base)} = ${termsText([...base.terms, { case: `${bare} loads`, factor: 1 }])} (${m[3]} forces along ${m[2]} added by the analysis)`;
  }
  return null;
}
