/** The `models` and `model_versions` tables (Storage in DEVELOPERS.md). */
import { EntitySchema } from 'typeorm';
import type { DesignCode, UnitSystem } from '../../shared/model/types.js';

export interface ModelRecord {
  id: number;
  projectId: number;
  name: string;
  /** the newest version number; bumped only together with inserting that version */
  currentVersion: number;
  /** copied from the current version's settings for lists */
  designCode: DesignCode;
  units: UnitSystem;
  /** rows per table of the current version, JSON */
  countsJson: string;
  createdBy: number | null;
  createdAt: Date;
  updatedAt: Date;
}

export const ModelEntity = new EntitySchema<ModelRecord>({
  name: 'Model',
  tableName: 'models',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    projectId: { type: 'integer' },
    name: { type: 'varchar', length: 200 },
    currentVersion: { type: 'integer' },
    designCode: { type: 'varchar', length: 32 },
    units: { type: 'varchar', length: 8 },
    countsJson: { type: 'text', default: '{}' },
    createdBy: { type: 'integer', nullable: true },
    createdAt: { type: 'datetime', createDate: true },
    updatedAt: { type: 'datetime', updateDate: true },
  },
});

export interface ModelVersionRecord {
  id: number;
  modelId: number;
  version: number;
  origin: 'import' | 'edit';
  message: string;
  /** SHA-256 of the model JSON */
  contentHash: string;
  /** gzip(JSON of the validated Model, SI units) */
  modelData: Buffer;
  /** import versions: gzip(JSON [{ name, base64 }]) of the uploaded files as received */
  sourceData: Buffer | null;
  /** edit versions: JSON of the edits applied to the previous version */
  editsJson: string | null;
  createdBy: number | null;
  createdAt: Date;
}

export const ModelVersionEntity = new EntitySchema<ModelVersionRecord>({
  name: 'ModelVersion',
  tableName: 'model_versions',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    modelId: { type: 'integer' },
    version: { type: 'integer' },
    origin: { type: 'varchar', length: 16 },
    message: { type: 'text', default: '' },
    contentHash: { type: 'varchar', length: 64 },
    modelData: { type: 'blob' },
    sourceData: { type: 'blob', nullable: true },
    editsJson: { type: 'text', nullable: true },
    createdBy: { type: 'integer', nullable: true },
    createdAt: { type: 'datetime', createDate: true },
  },
});
