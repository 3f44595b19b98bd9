import { describe, expect, it } from 'vitest';
import { firstSteps, profileFilled } from '../../../shared/domain/first-steps';

const blank = { homeAreaSet: false, address: null, phone: null, email: null, website: null, logoKey: null, clients: 0 };

describe('firstSteps', () => {
  it('lists home area, profile and first client, none done, for a new firm', () => {
    expect(firstSteps(blank)).toEqual([
      { key: 'home-area', done: false },
      { key: 'profile', done: false },
      { key: 'first-client', done: false },
    ]);
  });

  it('ticks each step off from the firm’s data', () => {
    expect(firstSteps({ ...blank, homeAreaSet: true })?.[0]?.done).toBe(true);
    expect(firstSteps({ ...blank, address: '1 Main St', phone: '608-555-0100' })?.[1]?.done).toBe(true);
    expect(firstSteps({ ...blank, clients: 1 })?.[2]?.done).toBe(true);
  });

  it('is gone once every step is done', () => {
    expect(firstSteps({ ...blank, homeAreaSet: true, address: '1 Main St', logoKey: 'logos/x.png', clients: 3 })).toBeNull();
  });
});

describe('profileFilled', () => {
  it('needs an address and one way to reach the firm; blanks do not count', () => {
    expect(profileFilled({ ...blank, address: '1 Main St' })).toBe(false);
    expect(profileFilled({ ...blank, phone: '608-555-0100' })).toBe(false);
    expect(profileFilled({ ...blank, address: '   ', phone: '608-555-0100' })).toBe(false);
    expect(profileFilled({ ...blank, address: '1 Main St', email: 'office@example.test' })).toBe(true);
  });
});
