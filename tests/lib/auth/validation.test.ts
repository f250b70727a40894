import { describe, expect, it } from 'vitest';
import { AddMemberSchema, safeNextPath, SignInSchema } from '../../../src/lib/auth/validation';

describe('safeNextPath(value)', () => {
  it.each([
    [null, '/'],
    [undefined, '/'],
    ['', '/'],
    ['https://evil.example/', '/'],
    ['//evil.example/', '/'],
    ['/\\evil.example', '/'],
    ['javascript:alert(1)', '/'],
    ['/firm/members', '/firm/members'],
    ['/?q=jump', '/?q=jump'],
  ])('maps %s to %s', (value, expected) => expect(safeNextPath(value)).toBe(expected));
});

describe('SignInSchema', () => {
  it('normalises the e-mail to trimmed lower case', () => {
    expect(SignInSchema.parse({ email: '  Tomas.Ilvar@KestrelWeir.example ', password: 'x' }).email).toBe(
      'tomas.ilvar@kestrelweir.example',
    );
  });
  it('asks for a password', () => {
    const result = SignInSchema.safeParse({ email: 'a@b.example', password: '' });
    expect(result.success).toBe(false);
    expect(result.error?.issues[0]?.message).toBe('Enter your password.');
  });
});

describe('AddMemberSchema', () => {
  const good = { name: 'Nadia Kerr', email: 'nadia@firm.example', role: 'reviewer', temporaryPassword: 'long-enough-1' };
  it('accepts a complete colleague', () => expect(AddMemberSchema.safeParse(good).success).toBe(true));
  it.each([
    ['name', { ...good, name: ' ' }],
    ['email', { ...good, email: 'nadia' }],
    ['role', { ...good, role: 'owner' }],
    ['temporaryPassword', { ...good, temporaryPassword: 'short' }],
  ])('names the bad field %s', (field, input) => {
    const result = AddMemberSchema.safeParse(input);
    expect(result.error?.issues.map((i) => i.path[0])).toEqual([field]);
  });
});
