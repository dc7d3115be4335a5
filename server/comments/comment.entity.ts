/** The `comments` table: remarks on a run or on one member of it. */
import { EntitySchema } from 'typeorm';

export interface CommentRecord {
  id: number;
  runId: number;
  /** member id, or null for the whole run */
  member: string | null;
  body: string;
  userId: number | null;
  createdAt: Date;
}

export const CommentEntity = new EntitySchema<CommentRecord>({
  name: 'Comment',
  tableName: 'comments',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    runId: { type: 'integer' },
    member: { type: 'varchar', length: 100, nullable: true },
    body: { type: 'text' },
    userId: { type: 'integer', nullable: true },
    createdAt: { type: 'datetime', createDate: true },
  },
});
