export { MEMBER_FAILURES } from './messages';
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
