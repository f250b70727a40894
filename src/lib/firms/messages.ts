import type { AcceptInvitationResult, InviteResult, RevokeInvitationResult } from './invitations';
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

type InvitationFailure =
  | Extract<InviteResult | RevokeInvitationResult, { ok: false }>['reason']
  | Extract<AcceptInvitationResult, { ok: false }>['reason'];

/** HTTP status and wording for each refused invitation step; shared by pages and API. */
export const INVITATION_FAILURES: Record<InvitationFailure, { status: number; code: string; message: string }> = {
  already_member: {
    status: 409,
    code: 'already_member',
    message: 'That person is already a member of your firm; change their role in the members table instead.',
  },
  not_found: { status: 404, code: 'not_found', message: 'That invitation was not found.' },
  not_pending: { status: 409, code: 'not_pending', message: 'That invitation was already used or withdrawn.' },
  expired: {
    status: 410,
    code: 'expired',
    message: 'This invitation link has expired. Ask your firm admin to send you a new invitation.',
  },
  used: {
    status: 410,
    code: 'used',
    message: 'This invitation link has already been used. Sign in with the password you chose, or ask your firm admin for a new invitation.',
  },
  revoked: {
    status: 410,
    code: 'revoked',
    message: 'This invitation was withdrawn or replaced by a newer one. Ask your firm admin to send you a new invitation.',
  },
  existing_account: {
    status: 409,
    code: 'existing_account',
    message:
      'This e-mail address already has a Sequent account. Sign in with it and ask the firm admin to add you to the firm from Firm & people.',
  },
};
