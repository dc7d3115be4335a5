/** Grid cell checks before an edit is sent (issue 11): overflowing numbers refused, lb = 0 allowed. */
import { describe, expect, it } from 'vitest';
import { validateMemberCell, type EditChoices } from '../../src/utils/memberEdits.js';

const choices: EditChoices = { sections: [], catalogue: [], materials: [], builtInMaterials: [] };

describe('member cell numbers', () => {
  it('refuses 1e309 (Infinity would travel as JSON null and clear the cell)', () => {
    const r = validateMemberCell('l_major', '1e309', choices);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toContain('not a finite number');
  });

  it('accepts lb = 0 (continuously braced) and refuses l_major = 0', () => {
    expect(validateMemberCell('lb', '0', choices)).toEqual({ ok: true, value: 0 });
    expect(validateMemberCell('lb', '-1', choices).ok).toBe(false);
    expect(validateMemberCell('l_major', '0', choices).ok).toBe(false);
  });
});
