export { auth, MIN_PASSWORD_LENGTH, type Auth, type AuthSession } from './auth';
export { hashPassword } from './passwords';
export { forwardToAuth, isOpenAuthPath, signInWithPassword, signOut, type SignInResult } from './handler';
export { AcceptInvitationSchema, AddMemberSchema, ChangeRoleSchema, ForgotPasswordSchema, InviteMemberSchema, ResetPasswordSchema, SignInSchema, safeNextPath } from './validation';
export { INVALID_LINK, isResetTokenUsable, requestPasswordReset, resetPassword, type ResetRequestResult, type ResetResult } from './passwordReset';
export { RESET_TOKEN_MINUTES } from './resetMail';
export { ROLES, ROLE_LABELS, RoleSchema, asRole, can, type Role } from './roles';
