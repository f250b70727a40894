import { z } from 'zod';
import { MIN_PASSWORD_LENGTH } from './auth';
import { RoleSchema } from './roles';

/** The sign-in form. */
export const SignInSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter the e-mail address of your account.'),
  password: z.string().min(1, 'Enter your password.'),
  remember: z.literal('on').optional(),
});

/** An admin adding a colleague with a temporary password. */
export const AddMemberSchema = z.object({
  /** Full name as it appears on calculation sheets. */
  name: z.string().trim().min(2, 'Enter the full name.').max(120, 'Keep the name under 120 characters.'),
  /** The colleague's work e-mail; it is their sign-in name. */
  email: z.string().trim().toLowerCase().email('Enter a valid e-mail address.'),
  role: RoleSchema,
  /** Given to the colleague out of band; they should change it after signing in. */
  temporaryPassword: z
    .string()
    .min(MIN_PASSWORD_LENGTH, `The temporary password needs at least ${MIN_PASSWORD_LENGTH} characters.`)
    .max(128, 'Keep the password under 128 characters.'),
});

/** An admin inviting a colleague by e-mail. */
export const InviteMemberSchema = z.object({
  /** The colleague's work e-mail; the invitation goes there and becomes their sign-in name. */
  email: z.string().trim().toLowerCase().email('Enter a valid e-mail address.'),
  role: RoleSchema,
});

/** The invited colleague choosing their name and password on the join page. */
export const AcceptInvitationSchema = z
  .object({
    /** Full name as it appears on calculation sheets. */
    name: z.string().trim().min(2, 'Enter your full name.').max(120, 'Keep the name under 120 characters.'),
    password: z
      .string()
      .min(MIN_PASSWORD_LENGTH, `Choose a password of at least ${MIN_PASSWORD_LENGTH} characters.`)
      .max(128, 'Keep the password under 128 characters.'),
    /** The same password again, to catch a typing slip. */
    passwordRepeat: z.string(),
  })
  .refine((v) => v.password === v.passwordRepeat, { path: ['passwordRepeat'], message: 'The two passwords differ. Type the same password twice.' });

/** An admin changing a member's role. */
export const ChangeRoleSchema = z.object({ role: RoleSchema });

/**
 * Where to go after signing in: only a path on this site (never `//host` or a full URL),
 * so the sign-in page cannot be used to send people elsewhere.
 */
export function safeNextPath(value: string | null | undefined): string {
  if (!value || !value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return '/';
  return value;
}

/** Asking for a password-reset link. */
export const ForgotPasswordSchema = z.object({
  email: z.string().trim().toLowerCase().email('Enter the e-mail address of your account.'),
});

/** Choosing a new password with the token from a reset link. */
export const ResetPasswordSchema = z
  .object({
    token: z.string().min(1, 'This page needs the link from the reset e-mail.'),
    password: z
      .string()
      .min(MIN_PASSWORD_LENGTH, `The new password needs at least ${MIN_PASSWORD_LENGTH} characters.`)
      .max(128, 'Keep the password under 128 characters.'),
    confirm: z.string(),
  })
  .refine((v) => v.password === v.confirm, { message: 'The two passwords differ. Type the same one twice.', path: ['confirm'] });
