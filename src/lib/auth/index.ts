export { auth, MIN_PASSWORD_LENGTH, type Auth, type AuthSession } from './auth';
export { hashPassword } from './passwords';
export { forwardToAuth, isOpenAuthPath, signInWithPassword, signOut, type SignInResult } from './handler';
export { AcceptInvitationSchema, AddMemberSchema, ChangeRoleSchema, InviteMemberSchema, SignInSchema, safeNextPath } from './validation';
export { ROLES, ROLE_LABELS, RoleSchema, asRole, can, type Role } from './roles';
