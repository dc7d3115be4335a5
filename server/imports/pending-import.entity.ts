/** The `pending_imports` table: a validated upload waiting to be committed (or to expire). */
import { EntitySchema } from 'typeorm';

export interface PendingImportRecord {
  id: string;
  projectId: number;
  modelId: number | null;
  baseVersion: number | null;
  name: string;
  /** the ImportPreview returned to the client, JSON */
  previewJson: string;
  /** gzip(JSON Model) when the upload had no errors, else null */
  modelData: Buffer | null;
  /** gzip(JSON [{ name, base64 }]) of the uploaded files */
  sourceData: Buffer;
  createdBy: number | null;
  createdAt: Date;
  expiresAt: Date;
}

export const PendingImportEntity = new EntitySchema<PendingImportRecord>({
  name: 'PendingImport',
  tableName: 'pending_imports',
  columns: {
    id: { type: 'varchar', length: 36, primary: true },
    projectId: { type: 'integer' },
    modelId: { type: 'integer', nullable: true },
    baseVersion: { type: 'integer', nullable: true },
    name: { type: 'varchar', length: 200 },
    previewJson: { type: 'text' },
    modelData: { type: 'blob', nullable: true },
    sourceData: { type: 'blob' },
    createdBy: { type: 'integer', nullable: true },
    createdAt: { type: 'datetime', createDate: true },
    expiresAt: { type: 'datetime' },
  },
});
