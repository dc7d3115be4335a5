/** The suggestions as a table (`suggestions.csv` of the batch command). Masses in kg; ratios as numbers. */
import type { ResultTable } from '../../exports/results.js';
import type { SuggestResult } from './types.js';

export const SUGGESTIONS_HEADER = [
  'for', 'name', 'members', 'current', 'current_ratio', 'proposed', 'proposed_ratio', 'governing',
  'mass_per_length_now [kg/m]', 'mass_per_length_proposed [kg/m]', 'mass_change [kg]', 'reason',
];

const round = (v: number | null, digits: number) => (v === null || !Number.isFinite(v) ? null : Number(v.toFixed(digits)));

export function suggestionsTable(result: SuggestResult): ResultTable {
  return {
    name: 'suggestions',
    header: SUGGESTIONS_HEADER,
    rows: result.proposals.map((p) => [
      p.unit, p.key, p.members.join(' '), p.current.join(' '), round(p.currentRatio, 3),
      p.change ? p.proposed : null, p.change ? round(p.proposedRatio, 3) : null, p.change ? p.governing : '',
      round(p.currentMassPerLength, 2), p.change ? round(p.proposedMassPerLength, 2) : null, round(p.massChange, 1),
      p.reason,
    ]),
  };
}
