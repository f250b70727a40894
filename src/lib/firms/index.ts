export { INVITATION_FAILURES, MEMBER_FAILURES } from './messages';
export { resolveFirm, type Firm, type FirmContext } from './firm';
export {
  addMember,
  changeMemberRole,
  ensureFirm,
  listMembers,
  type AddMemberResult,
  type ChangeRoleResult,
  type FirmMember,
  type HashPassword,
} from './members';
export {
  INVITATION_LIFETIME_DAYS,
  acceptInvitation,
  findInvitation,
  hashInvitationToken,
  inviteMember,
  listInvitations,
  revokeInvitation,
  type AcceptInvitationResult,
  type FindInvitationResult,
  type InvitationProblem,
  type InviteResult,
  type OpenInvitation,
  type PendingInvitation,
  type RevokeInvitationResult,
} from './invitations';
