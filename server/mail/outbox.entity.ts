/** The `mail_outbox` table: messages received by the built-in capture SMTP server. */
import { EntitySchema } from 'typeorm';

export interface OutboxRecord {
  id: number;
  fromAddress: string;
  /** JSON array of recipients (the SMTP envelope) */
  toJson: string;
  subject: string;
  text: string;
  html: string;
  /** X-Trestle-Kind header: invite, reset, submitted, returned, approved */
  kind: string;
  receivedAt: Date;
}

export const OutboxEntity = new EntitySchema<OutboxRecord>({
  name: 'OutboxMessage',
  tableName: 'mail_outbox',
  columns: {
    id: { type: 'integer', primary: true, generated: 'increment' },
    fromAddress: { type: 'varchar', length: 320 },
    toJson: { type: 'text' },
    subject: { type: 'text' },
    text: { type: 'text' },
    html: { type: 'text' },
    kind: { type: 'varchar', length: 32, default: '' },
    receivedAt: { type: 'datetime', createDate: true },
  },
});
