import { describe, expect, it } from 'vitest';
import { designCodeLabel, errorMessage, fieldErrors, formatDateTime, initials, roleLabel, selectItems, unitsLabel } from '../../src/utils/format.js';
import { ApiError } from '../../src/api/http.js';
import { DESIGN_CODES } from '../../shared/model/types.js';
import { ROLES } from '../../shared/schemas/users.js';

describe('labels', () => {
  it('gives every design code, unit system and role a readable label', () => {
    for (const code of DESIGN_CODES) expect(designCodeLabel(code)).not.toBe(code);
    expect(designCodeLabel('en1993-1-1')).toBe('EN 1993-1-1');
    expect(designCodeLabel('aisc360-asd')).toContain('ASD');
    expect(unitsLabel('us')).toContain('kip');
    expect(unitsLabel('metric')).toContain('kN');
    expect(new Set(ROLES.map(roleLabel)).size).toBe(ROLES.length);
  });

  it('builds select items in the order given', () => {
    expect(selectItems(['us', 'metric'] as const, unitsLabel).map((i) => i.value)).toEqual(['us', 'metric']);
  });
});

describe('formatDateTime', () => {
  it('shows an ISO timestamp as date and minutes in the given offset', () => {
    expect(formatDateTime('2026-03-04T05:06:07.000Z', 0)).toBe('2026-03-04 05:06');
    expect(formatDateTime('2026-03-04T23:30:00.000Z', 60)).toBe('2026-03-05 00:30');
    expect(formatDateTime('2026-03-04T00:15:00.000Z', -120)).toBe('2026-03-03 22:15');
  });

  it('shows nothing for an empty or unreadable value', () => {
    expect(formatDateTime('')).toBe('');
    expect(formatDateTime(null)).toBe('');
    expect(formatDateTime('not a date')).toBe('');
  });
});

describe('initials', () => {
  it('takes first and last initials of a name, and the first letter of an address', () => {
    expect(initials('Eli Engineer')).toBe('EE');
    expect(initials('Mary Ann Lee')).toBe('ML');
    expect(initials('viewer@example.com')).toBe('V');
    expect(initials('   ')).toBe('?');
  });
});

describe('errorMessage and fieldErrors', () => {
  it('shows the server message of an API error', () => {
    expect(errorMessage(new ApiError(403, 'forbidden', 'Your role may not do this'))).toBe('Your role may not do this');
  });

  it('falls back to a generic message for anything without one', () => {
    expect(errorMessage(undefined)).toMatch(/went wrong/);
    expect(errorMessage({ message: '  ' })).toMatch(/went wrong/);
  });

  it('reads field messages from validation details and ignores anything else', () => {
    const err = new ApiError(400, 'validation_failed', 'Check the fields', {
      fieldErrors: { name: ['Name is required'], units: ['bad', 3], empty: [] },
      formErrors: [],
    });
    expect(fieldErrors(err)).toEqual({ name: ['Name is required'], units: ['bad'] });
    expect(fieldErrors(new ApiError(400, 'bad_request', 'x', 'plain'))).toEqual({});
    expect(fieldErrors(new Error('x'))).toEqual({});
  });
});
