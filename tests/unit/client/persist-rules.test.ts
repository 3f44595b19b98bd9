import { describe, expect, it } from 'vitest';
import { describeAge, shouldPersistQuery } from '../../../src/lib/persist-rules';

describe('what is kept on the phone for no signal', () => {
  it('keeps the signed-in person, the crew’s tasks and field sheet', () => {
    expect(shouldPersistQuery(['auth', 'me'], 'crew')).toBe(true);
    expect(shouldPersistQuery(['tasks', 'mine'], 'crew')).toBe(true);
    expect(shouldPersistQuery(['tasks', 'detail', 7], 'crew')).toBe(true);
    expect(shouldPersistQuery(['field', 'home'], 'consultant')).toBe(true);
  });

  it('keeps a landowner’s own portal, never a staff preview of it', () => {
    expect(shouldPersistQuery(['portal', 'own', 0, 'properties'], 'client')).toBe(true);
    expect(shouldPersistQuery(['portal', 'preview', 12, 'properties'], 'consultant')).toBe(false);
    expect(shouldPersistQuery(['invoices', 'mine'], 'client')).toBe(true);
  });

  it('keeps none of a consultant’s working data', () => {
    expect(shouldPersistQuery(['desk'], 'consultant')).toBe(false);
    expect(shouldPersistQuery(['properties', 4, 'plan'], 'owner')).toBe(false);
    expect(shouldPersistQuery(['calendar-feeds'], 'owner')).toBe(false);
    expect(shouldPersistQuery([42], 'client')).toBe(false);
  });
});

describe('how old the shown data is', () => {
  const t0 = Date.UTC(2026, 4, 1, 12, 0);
  it('says it as a person would (common practice, no source)', () => {
    expect(describeAge(t0, t0 + 20_000)).toBe('just now');
    expect(describeAge(t0, t0 + 60_000)).toBe('1 minute ago');
    expect(describeAge(t0, t0 + 12 * 60_000)).toBe('12 minutes ago');
    expect(describeAge(t0, t0 + 3 * 3600_000 + 59 * 60_000)).toBe('3 hours ago');
    expect(describeAge(t0, t0 + 49 * 3600_000)).toBe('2 days ago');
    expect(describeAge(t0 + 5000, t0)).toBe('just now');
  });
});
