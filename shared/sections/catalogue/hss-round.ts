/**
 * Round HSS (ASTM A500) and standard / extra-strong pipe (ASTM A53 Gr B).
 * Source: sizes per AISC Steel Construction Manual, 16th ed., Tables 1-13 (round HSS) and
 * 1-14 (pipe) (from memory). Properties computed from the design wall thickness
 * t = 0.93·t_nom (AISC 360-22 B4.2, and the Manual's basis for pipe, from memory).
 * Designations: "HSS8.625X0.322" (also "HSS8.625X.322"; decimals are compared as numbers), "PIPE4STD", "PIPE4XS",
 * "PIPE2-1/2STD".
 */
import type { CatalogueEntry, CatalogueSeries } from './types.js';

// D, t_nom [in], written as in the designation
const HSS: [string, string][] = [
  ['1.660', '0.140'], ['2.375', '0.154'], ['2.875', '0.203'], ['3.500', '0.216'], ['4.000', '0.226'],
  ['4.500', '0.237'], ['5.563', '0.258'], ['6.625', '0.280'], ['6.625', '0.432'], ['8.625', '0.322'],
  ['8.625', '0.500'], ['10.750', '0.365'], ['10.750', '0.500'], ['12.750', '0.375'], ['12.750', '0.500'],
  ['14.000', '0.375'], ['16.000', '0.500'], ['20.000', '0.500'],
];

// nominal size, D, t_nom [in]
const PIPE_STD: [string, number, number][] = [
  ['2', 2.375, 0.154], ['2-1/2', 2.875, 0.203], ['3', 3.5, 0.216], ['3-1/2', 4.0, 0.226], ['4', 4.5, 0.237],
  ['5', 5.563, 0.258], ['6', 6.625, 0.28], ['8', 8.625, 0.322], ['10', 10.75, 0.365], ['12', 12.75, 0.375],
];
const PIPE_XS: [string, number, number][] = [
  ['2', 2.375, 0.218], ['3', 3.5, 0.3], ['4', 4.5, 0.337], ['6', 6.625, 0.432], ['8', 8.625, 0.5],
  ['10', 10.75, 0.5], ['12', 12.75, 0.5],
];

// tabulated A [in2], I [in4], AISC Manual Tables 1-13 / 1-14 (from memory)
const HSS_TABULATED: Record<string, { A: number; I_major: number; I_minor: number }> = {
  '4.500X0.237': { A: 2.96, I_major: 6.82, I_minor: 6.82 },
  '6.625X0.280': { A: 5.20, I_major: 26.5, I_minor: 26.5 },
  '8.625X0.322': { A: 7.85, I_major: 68.1, I_minor: 68.1 },
};
const PIPE_TABULATED: Record<string, { A: number; I_major: number; I_minor: number }> = {
  '4STD': { A: 2.96, I_major: 6.82, I_minor: 6.82 },
  '6STD': { A: 5.20, I_major: 26.5, I_minor: 26.5 },
  '8STD': { A: 7.85, I_major: 68.1, I_minor: 68.1 },
};

function hssEntry([D, t]: [string, string]): CatalogueEntry {
  return {
    name: `HSS${D}X${t}`,
    shape: 'chs',
    dims: { D: Number(D), t: 0.93 * Number(t) },
    tabulated: HSS_TABULATED[`${D}X${t}`],
  };
}

function pipeEntry(weight: 'STD' | 'XS') {
  return ([size, D, t]: [string, number, number]): CatalogueEntry => ({
    name: `PIPE${size}${weight}`,
    shape: 'chs',
    dims: { D, t: 0.93 * t },
    // e.g. Pipe 4 Std: A = 2.96 in2, I = 6.82 in4 (AISC Manual Table 1-14, from memory)
    tabulated: PIPE_TABULATED[`${size}${weight}`],
  });
}

export const HSS_ROUND: CatalogueSeries = {
  series: 'HSS (round)',
  source: 'Round HSS sizes per AISC Steel Construction Manual, 16th ed., Table 1-13 (from memory); design wall 0.93·t_nom (AISC 360-22 B4.2)',
  unit: 'in',
  entries: HSS.map(hssEntry),
};

export const PIPE: CatalogueSeries = {
  series: 'Pipe',
  source: 'Standard and extra-strong pipe per AISC Steel Construction Manual, 16th ed., Table 1-14 (from memory); design wall 0.93·t_nom',
  unit: 'in',
  entries: [...PIPE_STD.map(pipeEntry('STD')), ...PIPE_XS.map(pipeEntry('XS'))],
};
