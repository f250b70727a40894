import { describe, expect, it } from 'vitest';
import { ForgotPasswordSchema, ResetPasswordSchema } from '../../../src/lib/auth/validation';

describe('ForgotPasswordSchema', () => {
  it('trims and lower-cases the address', () => {
    expect(ForgotPasswordSchema.parse({ email: '  Ada.Quillon@Brightwater.example ' }).email).toBe('ada.quillon@brightwater.example');
  });
  it('refuses a malformed address with a message for engineers', () => {
    const result = ForgotPasswordSchema.safeParse({ email: 'ada' });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.message).toBe('Enter the e-mail address of your account.');
  });
});

describe('ResetPasswordSchema', () => {
  const ok = { token: 'abc123', password: 'long-enough-1', confirm: 'long-enough-1' };
  it('accepts a token and the same password twice', () => {
    expect(ResetPasswordSchema.safeParse(ok).success).toBe(true);
  });
  it.each([
    [{ ...ok, confirm: 'long-enough-2' }, 'confirm', 'The two passwords differ.'],
    [{ ...ok, password: 'short', confirm: 'short' }, 'password', 'at least 10 characters'],
    [{ ...ok, password: 'x'.repeat(129), confirm: 'x'.repeat(129) }, 'password', 'under 128'],
    [{ ...ok, token: '' }, 'token', 'link from the reset e-mail'],
  ])('refuses %j on %s', (input, field, message) => {
    const result = ResetPasswordSchema.safeParse(input);
    expect(result.success).toBe(false);
    const issue = result.error!.issues.find((i) => i.path[0] === field);
    expect(issue?.message).toContain(message);
  });
});
