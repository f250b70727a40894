/**
 * Reading the audit trail: a firm's events newest first, filtered by action and dates,
 * paged by keyset (the last event's id: stable while new events arrive, and as fast on
 * page 500 as on page 1), with the actor and the target's name joined in.
 */
import { and, desc, eq, gte, lt, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import { z } from 'zod';
import type { Database } from '../../db/client';
import { auditEvent, caseFile, member, user } from '../../db/schema';

const blankToUndefined = (value: unknown) => (typeof value === 'string' && value.trim() === '' ? undefined : value);
const day = z.preprocess(blankToUndefined, z.string().trim().regex(/^\d{4}-\d{2}-\d{2}$/, 'Give the date as YYYY-MM-DD.').refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)), 'That is not a calendar date.').optional());

/** The filters of the audit page and the CSV export (query-string values; blanks mean "any"). */
export const AuditFilterSchema = z
  .object({
    /** One action, e.g. `case.approved`. */
    action: z.preprocess(blankToUndefined, z.string().trim().max(64).regex(/^[a-z][a-z_]*(\.[a-z_]+)+$/, 'Choose an action from the list.').optional()),
    /** First day included (UTC). */
    from: day,
    /** Last day included (UTC). */
    to: day,
    /** Page cursor: events older than this event. */
    before: z.preprocess(blankToUndefined, z.coerce.number({ message: 'The page link is not valid.' }).int().positive().optional()),
  })
  .refine((f) => !f.from || !f.to || f.from <= f.to, { message: 'The first day must not be after the last day.', path: ['to'] });

/** Parsed audit filters. */
export type AuditFilter = z.output<typeof AuditFilterSchema>;

/** One event as the audit page and export show it. */
export interface AuditRow {
  id: number;
  createdAt: Date;
  action: string;
  actorName: string | null;
  actorEmail: string | null;
  targetType: string | null;
  targetId: string | null;
  /** The case's title or the member's name, when the target still exists in the firm. */
  targetTitle: string | null;
  details: Record<string, unknown>;
}

/** Events per page of the audit page. */
export const AUDIT_PAGE_SIZE = 50;

const targetMember = alias(member, 'target_member');
const targetUser = alias(user, 'target_user');

function conditions(firmId: string, filter: AuditFilter): SQL[] {
  const out: SQL[] = [eq(auditEvent.firmId, firmId)];
  if (filter.action) out.push(eq(auditEvent.action, filter.action));
  if (filter.from) out.push(gte(auditEvent.createdAt, new Date(`${filter.from}T00:00:00Z`)));
  if (filter.to) out.push(lt(auditEvent.createdAt, new Date(Date.parse(`${filter.to}T00:00:00Z`) + 86_400_000)));
  // The cursor's own timestamp is read in SQL: a JavaScript Date would drop its microseconds.
  if (filter.before) {
    out.push(sql`(${auditEvent.createdAt}, ${auditEvent.id}) < (select c.created_at, c.id from audit_event c where c.id = ${filter.before} and c.firm_id = ${firmId})`);
  }
  return out;
}

async function selectEvents(database: Pick<Database, 'select'>, firmId: string, filter: AuditFilter, limit: number): Promise<AuditRow[]> {
  const rows = await database
    .select({
      id: auditEvent.id,
      createdAt: auditEvent.createdAt,
      action: auditEvent.action,
      actorName: user.name,
      actorEmail: user.email,
      targetType: auditEvent.targetType,
      targetId: auditEvent.targetId,
      caseTitle: caseFile.title,
      memberName: targetUser.name,
      details: auditEvent.details,
    })
    .from(auditEvent)
    .leftJoin(user, eq(user.id, auditEvent.actorUserId))
    .leftJoin(caseFile, and(eq(auditEvent.targetType, 'case'), eq(caseFile.id, auditEvent.targetId), eq(caseFile.firmId, firmId)))
    .leftJoin(targetMember, and(eq(auditEvent.targetType, 'member'), eq(targetMember.id, auditEvent.targetId), eq(targetMember.organizationId, firmId)))
    .leftJoin(targetUser, eq(targetUser.id, targetMember.userId))
    .where(and(...conditions(firmId, filter)))
    .orderBy(desc(auditEvent.createdAt), desc(auditEvent.id))
    .limit(limit);
  return rows.map(({ caseTitle, memberName, ...row }) => ({ ...row, details: row.details ?? {}, targetTitle: caseTitle ?? memberName ?? null }));
}

/** One page of the firm's events, newest first, and the cursor of the next (older) page. */
export async function listAuditEvents(
  database: Pick<Database, 'select'>,
  firmId: string,
  filter: AuditFilter,
  pageSize: number = AUDIT_PAGE_SIZE,
): Promise<{ events: AuditRow[]; nextBefore: number | null }> {
  const rows = await selectEvents(database, firmId, filter, pageSize + 1);
  const events = rows.slice(0, pageSize);
  return { events, nextBefore: rows.length > pageSize ? events[events.length - 1]!.id : null };
}

/** All of the firm's events matching `filter` (its cursor ignored), newest first, in batches. */
export async function* auditEventBatches(database: Pick<Database, 'select'>, firmId: string, filter: AuditFilter, batchSize = 1000): AsyncGenerator<AuditRow[]> {
  let before: number | undefined;
  for (;;) {
    const page = await listAuditEvents(database, firmId, { ...filter, before }, batchSize);
    if (page.events.length > 0) yield page.events;
    if (page.nextBefore === null) return;
    before = page.nextBefore;
  }
}

/** The actions that occur in the firm's trail, for the filter's list. */
export async function auditActionsOf(database: Pick<Database, 'selectDistinct'>, firmId: string): Promise<string[]> {
  const rows = await database.selectDistinct({ action: auditEvent.action }).from(auditEvent).where(eq(auditEvent.firmId, firmId)).orderBy(auditEvent.action);
  return rows.map((r) => r.action);
}
