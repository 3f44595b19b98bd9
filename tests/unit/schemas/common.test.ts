import { describe, expect, it } from 'vitest';
import { findUnstorableValue, IdSchema, isRealCalendarDate, IsoDateSchema, RecordIdSchema } from '../../../shared/schemas/common';

describe('isRealCalendarDate', () => {
  // Leap years by the Gregorian rule (divisible by 4, except centuries not divisible by 400): from memory.
  it.each([
    ['2024-02-29', true],
    ['2000-02-29', true],
    ['2025-02-29', false],
    ['2100-02-29', false],
    ['2026-02-30', false],
    ['2026-04-31', false],
    ['2026-12-31', true],
    ['2026-13-01', false],
    ['2026-00-10', false],
    ['0000-01-01', false], // PostgreSQL has no year 0 (PostgreSQL manual, date/time types)
    ['2026-1-01', false],
  ])('%s → %s', (v, ok) => {
    expect(isRealCalendarDate(v)).toBe(ok);
    expect(IsoDateSchema.safeParse(v).success).toBe(ok);
  });
});

describe('IdSchema', () => {
  it('takes digits and whole numbers that fit an INTEGER column', () => {
    expect(IdSchema.parse('17')).toBe(17);
    expect(IdSchema.parse(17)).toBe(17);
    expect(IdSchema.parse('2147483647')).toBe(2147483647); // 2^31 − 1, PostgreSQL manual, numeric types
  });
  it.each(['0x10', ' 1', '1 ', '+1', '01', '1e3', '1.0', '-1', '0', '', '2147483648', '9'.repeat(40), true, null, 1.5, 2147483648])('refuses %j', (v) => {
    expect(IdSchema.safeParse(v).success).toBe(false);
  });
  it('keeps body ids in range too', () => {
    expect(RecordIdSchema.safeParse(2147483648).success).toBe(false);
    expect(RecordIdSchema.safeParse('3').success).toBe(false);
  });
});

describe('findUnstorableValue', () => {
  it('finds NUL, lone surrogates and denormals anywhere, with their path', () => {
    expect(findUnstorableValue({ a: [{ b: 'x\u0000y' }] })?.path).toEqual(['a', 0, 'b']);
    expect(findUnstorableValue({ name: 'lone \ud800' })?.path).toEqual(['name']);
    expect(findUnstorableValue({ name: '\udc00' })?.message).toMatch(/broken character/);
    expect(findUnstorableValue({ q: 5e-324 })?.message).toMatch(/too close to zero/); // the smallest denormal double (IEEE 754)
    expect(findUnstorableValue({ ['k\u0000']: 1 })?.path).toEqual(['k\u0000']);
  });
  it('lets ordinary values pass, surrogate pairs (emoji) included', () => {
    expect(findUnstorableValue({ name: 'Deer 🦌 plot', n: 0, m: -1.5e-300, list: [1, 'ü', null, true] })).toBeNull();
    expect(findUnstorableValue(new Uint8Array([0, 0xff]))).toBeNull();
  });
});
