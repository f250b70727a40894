/** Test firms made directly through the services, each with unique names and addresses. */
import { randomUUID } from 'node:crypto';
import { db } from '../../src/db/client';
import { hashPassword, type Role } from '../../src/lib/auth';
import { addMember, ensureFirm, type Firm } from '../../src/lib/firms';

export const TEST_PASSWORD = 'correct-horse-battery';

export interface TestPerson {
  email: string;
  memberId: string;
  userId: string;
  role: Role;
}

export interface TestFirm {
  firm: Firm;
  people: Record<string, TestPerson>;
}

/** Creates a firm with the given people (key → role); everyone's password is TEST_PASSWORD. */
export async function makeFirm(people: Record<string, Role>): Promise<TestFirm> {
  const tag = randomUUID().slice(0, 8);
  const firm = await ensureFirm(db(), { name: `Test Firm ${tag}`, slug: `test-${tag}` });
  const out: Record<string, TestPerson> = {};
  for (const [key, role] of Object.entries(people)) {
    const email = `${key}.${tag}@firm.example`;
    const result = await addMember(db(), hashPassword, {
      firmId: firm.id,
      name: `${key} ${tag}`,
      email,
      role,
      temporaryPassword: TEST_PASSWORD,
      actorUserId: null,
    });
    if (!result.ok) throw new Error(`could not add ${email}: ${result.reason}`);
    out[key] = { email, memberId: result.member.memberId, userId: result.member.userId, role };
  }
  return { firm, people: out };
}
