import { bigserial, index, jsonb, pgTable, text, timestamp } from 'drizzle-orm/pg-core';
import { organization, user } from './auth';

/**
 * The append-only audit trail: who did what, in which firm, when, with details.
 * Rows are only ever inserted (see src/lib/audit/record.ts).
 */
export const auditEvent = pgTable(
  'audit_event',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    firmId: text('firm_id')
      .notNull()
      .references(() => organization.id, { onDelete: 'restrict' }),
    /** The person who acted; null for the system (seed, migrations, workers). */
    actorUserId: text('actor_user_id').references(() => user.id, { onDelete: 'set null' }),
    /** A dotted verb, e.g. `member.role_changed`. */
    action: text('action').notNull(),
    targetType: text('target_type'),
    targetId: text('target_id'),
    details: jsonb('details').$type<Record<string, unknown>>().notNull().default({}),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('audit_event_firm_created_idx').on(t.firmId, t.createdAt), index('audit_event_target_idx').on(t.targetId, t.createdAt)],
);
