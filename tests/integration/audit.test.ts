/** The audit trail is append-only, enforced by PostgreSQL (drizzle/0003_audit_event_append_only.sql). */
import { eq } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { db, pool } from '../../src/db/client';
import { auditEvent } from '../../src/db/schema';
import { recordAudit } from '../../src/lib/audit/record';
import { makeFirm } from '../helpers/firms';

describe('audit trail', () => {
  it('takes new events', async () => {
    const f = await makeFirm({ admin: 'admin' });
    const before = await db().select().from(auditEvent).where(eq(auditEvent.firmId, f.firm.id));
    await recordAudit(db(), { firmId: f.firm.id, actorUserId: f.people.admin!.userId, action: 'firm.created', targetType: 'firm', targetId: f.firm.id });
    const after = await db().select().from(auditEvent).where(eq(auditEvent.firmId, f.firm.id));
    expect(after.length).toBe(before.length + 1);
  });

  it('refuses UPDATE, DELETE and TRUNCATE, whoever asks', async () => {
    const f = await makeFirm({ admin: 'admin' });
    const [event] = await db().select({ id: auditEvent.id }).from(auditEvent).where(eq(auditEvent.firmId, f.firm.id)).limit(1);
    expect(event).toBeDefined();
    await expect(pool().query('update audit_event set action = $1 where id = $2', ['member.added', event!.id])).rejects.toThrow(/append-only: UPDATE/);
    await expect(pool().query('delete from audit_event where id = $1', [event!.id])).rejects.toThrow(/append-only: DELETE/);
    await expect(pool().query('truncate audit_event cascade')).rejects.toThrow(/append-only: TRUNCATE/);
    const [still] = await db().select({ id: auditEvent.id }).from(auditEvent).where(eq(auditEvent.id, event!.id));
    expect(still?.id).toBe(event!.id);
  });
});
