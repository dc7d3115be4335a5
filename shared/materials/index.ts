/** Built-in materials (contract stub: the materials work fills the table with sources). */
import type { Material } from '../model/types.js';

/** A built-in material by name (case-insensitive, spaces ignored), or undefined. */
export function builtInMaterial(name: string): Material | undefined {
  void name;
  return undefined;
}

export function builtInMaterialNames(): string[] {
  return [];
}
