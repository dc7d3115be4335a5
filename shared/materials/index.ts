/**
 * Built-in materials (./builtins.ts, each with its source). Names match case-insensitively
 * with spaces, hyphens and underscores ignored, and an optional "ASTM " prefix or
 * "Grade"/"Gr." spelling: "a572 gr 50", "A572GR50", "ASTM A572 Grade 50" all find A572 Gr 50;
 * "6061T6", "AL 6061-T6" find 6061-T6.
 */
import type { Material } from '../model/types.js';
import { BUILT_IN_MATERIALS } from './builtins.js';

export { BUILT_IN_MATERIALS };

/** The lookup key of a material name. */
export function normaliseMaterialName(name: string): string {
  return name
    .toUpperCase()
    .replace(/[\s\-_.]+/g, '')
    .replace(/^ASTM/, '')
    .replace(/^(ALUMINIUM|ALUMINUM|AL)(?=\d)/, '')
    .replace(/GRADE/g, 'GR');
}

let index: Map<string, Material> | undefined;

/** A built-in material by name (case-insensitive, spaces ignored), or undefined. */
export function builtInMaterial(name: string): Material | undefined {
  if (!index) index = new Map(BUILT_IN_MATERIALS.map((m) => [normaliseMaterialName(m.id), m]));
  const m = index.get(normaliseMaterialName(name));
  return m ? { ...m } : undefined;
}

export function builtInMaterialNames(): string[] {
  return BUILT_IN_MATERIALS.map((m) => m.id);
}
