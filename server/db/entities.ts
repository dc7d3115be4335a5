/**
 * Every TypeORM entity of the server. To add one: define it next to its router
 * (`server/<noun>/<noun>.entity.ts`, EntitySchema or decorators with explicit column types),
 * append it here, and add a migration that creates its table (see migrations/index.ts).
 */
import type { EntitySchema } from 'typeorm';
import { ProjectEntity } from '../projects/project.entity.js';
import { ModelEntity, ModelVersionEntity } from '../models/model.entity.js';
import { PendingImportEntity } from '../imports/pending-import.entity.js';
import { RunEntity, RunResultEntity } from '../runs/run.entity.js';
import { RunLoadingResultEntity, RunMemberResultEntity } from '../runs/result-parts.entity.js';
import { UserEntity } from '../users/user.entity.js';
import { ProjectMemberEntity } from '../membership/member.entity.js';
import { RunReviewEntity } from '../reviews/review.entity.js';
import { CommentEntity } from '../comments/comment.entity.js';
import { OutboxEntity } from '../mail/outbox.entity.js';
import { AuditEntity } from '../audit/audit.entity.js';
import { AccountTokenEntity } from '../security/account-token.entity.js';
import { RevokedSessionEntity } from '../security/revoked-session.entity.js';

// eslint-disable-next-line @typescript-eslint/no-explicit-any
export const entities: (EntitySchema<any> | Function)[] = [
  UserEntity,
  ProjectEntity,
  ModelEntity,
  ModelVersionEntity,
  PendingImportEntity,
  RunEntity,
  RunResultEntity,
  RunMemberResultEntity,
  RunLoadingResultEntity,
  ProjectMemberEntity,
  RunReviewEntity,
  CommentEntity,
  OutboxEntity,
  AuditEntity,
  AccountTokenEntity,
  RevokedSessionEntity,
];
