/** The `run_reviews` table: every review transition of a run, oldest first. */
import { EntitySchema } from 'typeorm';
import type { ReviewAction } from '../../shared/schemas/reviews.js';
import type { ReviewStatus } from '../../shared/schemas/runs.js';

export interface RunReviewRecord {
  id: number;
  runId: number;
  action: ReviewAction;
  fromStatus: ReviewStatus;
  toStatus: ReviewStatus;
  message: string;
  userId: number | null;
  createdAt: Date;
}

export const RunReviewEntity = new EntitySchema<RunReviewRecord>({
  name: 'RunReview',
  tableName: 'run_reviews',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    runId: { type: 'integer' },
    action: { type: 'varchar', length: 16 },
    fromStatus: { type: 'varchar', length: 16 },
    toStatus: { type: 'varchar', length: 16 },
    message: { type: 'text', default: '' },
    userId: { type: 'integer', nullable: true },
    createdAt: { type: 'datetime', createDate: true },
  },
});
