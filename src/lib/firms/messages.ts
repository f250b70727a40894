import type { AddMemberResult, ChangeRoleResult } from './members';

type Failure = Extract<ChangeRoleResult | AddMemberResult, { ok: false }>['reason'];

/** HTTP status and wording for each refused member change; shared by pages and API. */
export const MEMBER_FAILURES: Record<Failure, { status: number; code: string; message: string }> = {
  not_found: { status: 404, code: 'not_found', message: 'That member was not found in your firm.' },
  last_admin: {
    status: 409,
    code: 'last_admin',
    message: 'A firm needs at least one admin. Make someone else an admin before changing this role.',
  },
  already_member: { status: 409, code: 'already_member', message: 'That person is already a member of your firm.' },
};
