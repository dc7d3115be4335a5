/**
 * Fonts of the calculation package: Roboto as shipped in @fontsource/roboto (WOFF files, one per
 * script subset). A character is drawn with the first subset whose unicode-range (read from the
 * package's own CSS) covers it, so Greek symbols (φ, λ, γ) and ≤ print as the app shows them.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';

export type Weight = 400 | 700;

export interface FontFace {
  /** name registered with pdfkit */
  name: string;
  data: Buffer;
  ranges: [number, number][];
}

/** Subsets in the order they are tried. */
const SUBSETS = ['latin', 'latin-ext', 'greek', 'math', 'symbols'];

function parseRanges(text: string): [number, number][] {
  return text.split(',').map((part) => {
    const [a, b] = part.trim().replace(/^U\+/i, '').split('-');
    const lo = parseInt(a, 16);
    return [lo, b ? parseInt(b, 16) : lo] as [number, number];
  });
}

const cache = new Map<Weight, FontFace[]>();

/** The faces of one weight, most common script first. */
export function robotoFaces(weight: Weight): FontFace[] {
  const known = cache.get(weight);
  if (known) return known;
  const require = createRequire(import.meta.url);
  const dir = path.dirname(require.resolve('@fontsource/roboto/package.json'));
  const css = readFileSync(path.join(dir, `${weight}.css`), 'utf8');
  const faces: FontFace[] = [];
  for (const subset of SUBSETS) {
    const file = `roboto-${subset}-${weight}-normal.woff`;
    const block = new RegExp(`${file.replace(/[.-]/g, '\\$&')}\\)[^}]*unicode-range:\\s*([^;]+);`).exec(css);
    if (!block) throw new Error(`font ${file}: no unicode-range in @fontsource/roboto/${weight}.css`);
    faces.push({ name: `roboto-${subset}-${weight}`, data: readFileSync(path.join(dir, 'files', file)), ranges: parseRanges(block[1]) });
  }
  cache.set(weight, faces);
  return faces;
}

export function covers(face: FontFace, codePoint: number): boolean {
  for (const [lo, hi] of face.ranges) if (codePoint >= lo && codePoint <= hi) return true;
  return false;
}

/** Splits text into runs of one face each (characters no face covers stay with the first face). */
export function fontRuns(text: string, faces: FontFace[]): { face: FontFace; text: string }[] {
  const runs: { face: FontFace; text: string }[] = [];
  for (const ch of text) {
    const cp = ch.codePointAt(0)!;
    const face = faces.find((f) => covers(f, cp)) ?? faces[0];
    const last = runs[runs.length - 1];
    if (last && last.face === face) last.text += ch;
    else runs.push({ face, text: ch });
  }
  return runs;
}
