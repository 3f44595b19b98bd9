/**
 * The sign-up page's place search (`GET /api/signup/places?q=`): public, the same answers as the
 * signed-in search, validated, and rate-limited per address before any search is made.
 */
import { beforeEach, describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { testApp } from '../support/test-app';
import { sequelize } from '../../server/db/sequelize';
import { PlaceSchema, PUBLIC_PLACE_SEARCH_LIMIT } from '../../shared/schemas/places';

const clearHits = () => sequelize.query(`DELETE FROM rate_limit_hits WHERE key LIKE 'signup-places:%'`, { type: QueryTypes.DELETE });

describe('place search for the sign-up form', () => {
  beforeEach(clearHits);

  it('finds a county without a session (Crawford County, WI from the Census counties in us-atlas)', async () => {
    const res = await request(testApp()).get('/api/signup/places').query({ q: 'Crawford County, WI' });
    expect(res.status).toBe(200);
    const places = PlaceSchema.array().parse(res.body.data);
    expect(places[0]).toMatchObject({ name: 'Crawford County, WI', kind: 'county' });
    expect(places[0]!.bbox).toHaveLength(4);
  });

  it('refuses a search text over 200 characters with a sentence (400), and answers [] for punctuation only', async () => {
    const long = await request(testApp()).get('/api/signup/places').query({ q: 'x'.repeat(201) });
    expect(long.status).toBe(400);
    expect(long.body.error).toMatch(/at most 200 characters/);
    const dots = await request(testApp()).get('/api/signup/places').query({ q: '…!!' });
    expect(dots.status).toBe(200);
    expect(dots.body.data).toEqual([]);
  });

  it('stops an address after the limit with a 429 that says what to do', async () => {
    const app = testApp();
    for (let i = 0; i < PUBLIC_PLACE_SEARCH_LIMIT.max; i += 1) expect((await request(app).get('/api/signup/places').query({ q: 'vi' })).status).toBe(200);
    const over = await request(app).get('/api/signup/places').query({ q: 'viroqua' });
    expect(over.status).toBe(429);
    expect(over.body.error).toMatch(/set it later in Settings/);
    await clearHits();
  });
});
