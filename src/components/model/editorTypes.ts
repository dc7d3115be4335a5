/** Types the model table components share. */
export type { ModelTableColumn } from '../../../shared/schemas/models.js';
export type UnitSystemName = 'metric' | 'us';
