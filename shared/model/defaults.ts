/**
 * Defaults of the model fields added after the first release, so a model version stored
 * before them (JSON in the database) reads as the same model today.
 */
import type { Model, Settings } from './types.js';

/** Settings defaults (tables.md "settings"), except the title. */
export const SETTINGS_DEFAULTS: Omit<Settings, 'title'> = {
  units: 'metric',
  verticalAxis: 'Y',
  designCode: 'none',
  combinationRule: 'table',
  deflectionLimit: 360,
  // recommended partial factors, EN 1993-1-1 6.1(1) Note 2B
  gammaM0: 1.0,
  gammaM1: 1.0,
  gammaM2: 1.25,
  stations: 11,
  analysis: 'first_order',
  bucklingModes: 0,
  modes: 0,
  stabilityWarning: true,
};

/** settings `stations`: allowed range, both ends included (tables.md) */
export const STATIONS_MIN = 3;
export const STATIONS_MAX = 201;
/** settings `buckling_modes` and `modes`: our upper bound (more eigenpairs than a checker reads; each costs solves) */
export const MODES_MAX = 50;

/** Fill fields that older stored models lack; returns the same object. */
export function withModelDefaults(model: Model): Model {
  model.settings = { ...SETTINGS_DEFAULTS, ...model.settings };
  for (const c of model.cases) if (c.mass === undefined) c.mass = false;
  if (!model.resultPoints) model.resultPoints = [];
  if (!model.vehicles) model.vehicles = [];
  if (!model.lanes) model.lanes = [];
  if (!model.movingLoads) model.movingLoads = [];
  return model;
}
