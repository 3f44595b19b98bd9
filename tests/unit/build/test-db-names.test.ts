import { describe, expect, it } from 'vitest';
import { RUN_SUFFIX, runDatabaseName } from '../../support/test-db';

describe('test database names', () => {
  it('carry this run’s process id, so two runs on one machine never share a database', () => {
    expect(RUN_SUFFIX.startsWith(`${process.pid}_`)).toBe(true);
    expect(runDatabaseName('browseline_e2e')).toBe(`browseline_e2e_${RUN_SUFFIX}`);
    expect(runDatabaseName('browseline_e2e')).toMatch(/^[a-z][a-z0-9_]{0,62}$/);
  });

  it('refuse a name that is not a plain identifier', () => {
    expect(() => runDatabaseName('x; DROP DATABASE postgres')).toThrow(/plain database name/);
  });
});
