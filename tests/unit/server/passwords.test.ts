import { afterEach, describe, expect, it, vi } from 'vitest';

afterEach(() => {
  vi.unstubAllEnvs();
  vi.resetModules();
});

describe('sign-in timing', () => {
  it('compares against a dummy hash of the same cost as real hashes when the account does not exist', async () => {
    vi.stubEnv('BCRYPT_COST', '6');
    vi.resetModules();
    const { BCRYPT_COST, dummyHashCost, hashPassword } = await import('../../../server/services/auth/passwords');
    const bcrypt = (await import('bcryptjs')).default;
    expect(BCRYPT_COST).toBe(6);
    expect(bcrypt.getRounds(await hashPassword('walnut-creek-bedding-47'))).toBe(6);
    expect(dummyHashCost()).toBe(6);
  });
});
