/**
 * Deploys: migrations each in their own transaction, ETags that carry the build, and health that
 * turns 503 as soon as shutdown begins.
 */
import { afterAll, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { signedInAgent, testApp } from '../support/test-app';
import { makeFirm, makeProperty, PASSWORD } from '../support/factories';
import { sequelize } from '../../server/db/sequelize';
import { createMigrator, migrationConnection, type MigrationDefinition } from '../../server/db/migrator';
import { buildId } from '../../server/build-id';
import { beginDraining, endDraining } from '../../server/lifecycle';

const exists = async (table: string) =>
  (await sequelize.query<{ n: number }>(`SELECT count(*)::int AS n FROM information_schema.tables WHERE table_name = $1`, { bind: [table], type: QueryTypes.SELECT }))[0].n === 1;

describe('migrations', () => {
  const db = migrationConnection(process.env.DATABASE_URL);
  afterAll(async () => {
    await sequelize.query('DROP TABLE IF EXISTS deploy_test_a, deploy_test_b, deploy_test_meta');
    await db.close();
  });

  it('runs each migration in a transaction with its record, so a failed one leaves nothing behind', async () => {
    const migrations: MigrationDefinition[] = [
      { name: '9001-a', up: async ({ context: qi }) => void (await qi.sequelize.query('CREATE TABLE deploy_test_a (id INT)')) },
      {
        name: '9002-b',
        up: async ({ context: qi }) => {
          await qi.sequelize.query('CREATE TABLE deploy_test_b (id INT)');
          await qi.sequelize.query('INSERT INTO deploy_test_b VALUES (1)');
          await qi.sequelize.query('SELECT 1 / 0'); // fails halfway
        },
      },
    ];
    const migrator = createMigrator({ migrations, connection: db, metaTable: 'deploy_test_meta' });
    await expect(migrator.up()).rejects.toThrow();
    expect(await exists('deploy_test_a')).toBe(true);
    expect(await exists('deploy_test_b')).toBe(false); // rolled back whole
    expect((await migrator.executed()).map((m) => m.name)).toEqual(['9001-a']);
    expect((await migrator.pending()).map((m) => m.name)).toEqual(['9002-b']);
  });
});

describe('ETags', () => {
  it('carry the build, so a tag from an older build is answered in full, never with 304', async () => {
    const ctx = await makeFirm();
    const consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
    const property = await makeProperty(ctx.firm.id, ctx.client.id);
    const first = await consultant.get(`/api/properties/${property.id}/units`).expect(200);
    const etag = first.headers.etag as string;
    expect(etag).toContain(buildId);
    await consultant.get(`/api/properties/${property.id}/units`).set('If-None-Match', etag).expect(304);
    // The same plan revision as the previous build tagged it (before builds were in the tag).
    const older = etag.replace(`-${buildId}`, '');
    await consultant.get(`/api/properties/${property.id}/units`).set('If-None-Match', older).expect(200);
    await consultant.get(`/api/properties/${property.id}/units`).set('If-None-Match', etag.replace(buildId, 'an-older-build')).expect(200);
  });
});

describe('shutdown', () => {
  it('turns health to 503 the moment draining begins, and asks clients to close their connections', async () => {
    await request(testApp()).get('/api/health').expect(200);
    beginDraining();
    try {
      const res = await request(testApp()).get('/api/health');
      expect(res.status).toBe(503);
      expect(res.body).toEqual({ status: 'draining', database: 'ok' });
      expect(res.headers.connection).toBe('close');
    } finally {
      endDraining();
    }
    await request(testApp()).get('/api/health').expect(200);
  });
});
