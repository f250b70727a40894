import { describe, expect, it } from 'vitest';
import { asRole, can, ROLES, type Role } from '../../../src/lib/auth/roles';

describe('can(role, resource, action)', () => {
  it.each([
    [null, false],
    [undefined, false],
  ])('refuses everything without a role (%s)', (role, expected) => {
    expect(can(role, 'member', 'read')).toBe(expected);
  });

  const table: Array<[Role, Parameters<typeof can>[1], string, boolean]> = [
    ['engineer', 'case', 'create', true],
    ['engineer', 'case', 'review', false],
    ['engineer', 'member', 'read', true],
    ['engineer', 'member', 'update', false],
    ['engineer', 'member', 'create', false],
    ['reviewer', 'case', 'review', true],
    ['reviewer', 'case', 'withdraw', true],
    ['engineer', 'case', 'withdraw', false],
    ['reviewer', 'member', 'update', false],
    ['admin', 'member', 'update', true],
    ['admin', 'member', 'create', true],
    ['admin', 'case', 'withdraw', true],
    ['admin', 'case', 'review', false],
    ['admin', 'audit', 'read', true],
    ['admin', 'drift', 'run', true],
    ['engineer', 'audit', 'read', false],
    ['reviewer', 'audit', 'read', false],
    ['engineer', 'drift', 'run', false],
    ['reviewer', 'drift', 'run', false],
  ];
  it.each(table)('%s may %s.%s: %s', (role, resource, action, expected) => {
    expect(can(role, resource, action as never)).toBe(expected);
  });

  it('gives no role the organization plugin’s own firm powers', () => {
    for (const role of ROLES) {
      expect(can(role, 'organization', 'delete')).toBe(false);
      expect(can(role, 'organization', 'update')).toBe(false);
    }
  });
});

describe('asRole(value)', () => {
  it.each(['engineer', 'reviewer', 'admin'])('accepts %s', (role) => expect(asRole(role)).toBe(role));
  it.each([null, undefined, '', 'owner', 'member', 'Admin', 42, {}])('rejects %s', (value) => expect(asRole(value)).toBeNull());
});
