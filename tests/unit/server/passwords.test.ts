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

  it('makes the dummy comparison as a real one, and it never matches', async () => {
    vi.stubEnv('BCRYPT_COST', '5');
    vi.resetModules();
    const { verifyPassword } = await import('../../../server/services/auth/passwords');
    // A malformed dummy hash would make bcryptjs reject at once (cheaply) instead of hashing.
    await expect(verifyPassword('walnut-creek-bedding-47', null)).resolves.toBe(false);
    await expect(verifyPassword('', null)).resolves.toBe(false);
  });

  it('hashes and compares in a worker thread, not the calling one', async () => {
    vi.stubEnv('BCRYPT_COST', '4');
    vi.stubEnv('PASSWORD_WORKERS', '1');
    vi.resetModules();
    const bcrypt = (await import('bcryptjs')).default;
    const spies = [vi.spyOn(bcrypt, 'hash'), vi.spyOn(bcrypt, 'compare'), vi.spyOn(bcrypt, 'hashSync'), vi.spyOn(bcrypt, 'compareSync')];
    const { closePasswordWorkers, hashPassword, verifyPassword } = await import('../../../server/services/auth/passwords');
    try {
      const stored = await hashPassword('walnut-creek-bedding-47');
      expect(bcrypt.getRounds(stored)).toBe(4);
      await expect(verifyPassword('walnut-creek-bedding-47', stored)).resolves.toBe(true);
      await expect(verifyPassword('walnut-creek-bedding-48', stored)).resolves.toBe(false);
      for (const spy of spies) expect(spy).not.toHaveBeenCalled();
    } finally {
      await closePasswordWorkers();
      for (const spy of spies) spy.mockRestore();
    }
  });

  it('still hashes in the calling thread when PASSWORD_WORKERS=0', async () => {
    vi.stubEnv('BCRYPT_COST', '4');
    vi.stubEnv('PASSWORD_WORKERS', '0');
    vi.resetModules();
    const { hashPassword, verifyPassword } = await import('../../../server/services/auth/passwords');
    const stored = await hashPassword('walnut-creek-bedding-47');
    await expect(verifyPassword('walnut-creek-bedding-47', stored)).resolves.toBe(true);
  });
});
