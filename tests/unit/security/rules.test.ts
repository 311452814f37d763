/**
 * The rules that say who may do what live in lib/permissions.ts as predicates (issue 18, part 2);
 * pages and queries ask them instead of re-deriving them.
 */
import { describe, expect, it } from 'vitest';
import { AccessDenied, authorizeDecision, authorizeWithdrawal, awaitsAnotherDecider, isStaff, mayDecide, mayWithdraw, ROLES, type Actor, type Role } from '@/lib/permissions';

const person = (userId: string, role: Role): Actor => ({
  userId, role, email: `${userId}@example.test`, name: userId, workspaceId: 'w', workspaceName: 'W', via: 'session', massUnits: 'metric', temperatureUnit: 'C',
});
const request = { requestedById: 'ana' };

describe('four-eyes rule', () => {
  it('a head of product decides another person’s request', () => {
    expect(mayDecide(person('ben', 'head_of_product'), request)).toBe(true);
    expect(authorizeDecision(person('ben', 'head_of_product'), request).userId).toBe('ben');
  });

  it('never their own, and is told another head of product must decide', () => {
    const ana = person('ana', 'head_of_product');
    expect(mayDecide(ana, request)).toBe(false);
    expect(awaitsAnotherDecider(ana, request)).toBe(true);
    expect(() => authorizeDecision(ana, request)).toThrow(AccessDenied);
  });

  it('no other role decides, and only the deciding role is told to wait for another', () => {
    for (const role of ROLES.filter((r) => r !== 'head_of_product')) {
      expect(mayDecide(person('ben', role), request)).toBe(false);
      expect(awaitsAnotherDecider(person('ana', role), request)).toBe(false);
    }
  });
});

describe('withdrawal', () => {
  it('only the requester withdraws', () => {
    expect(mayWithdraw(person('ana', 'developer'), request)).toBe(true);
    expect(mayWithdraw(person('ben', 'admin'), request)).toBe(false);
    expect(() => authorizeWithdrawal(person('ben', 'admin'), request)).toThrow(/Only the person who made the request/);
  });
});

describe('staff', () => {
  it('tasters are the only non-staff role', () => {
    expect(ROLES.filter((r) => !isStaff(r))).toEqual(['taster']);
  });
});
