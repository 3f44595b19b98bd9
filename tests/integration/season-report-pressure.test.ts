/**
 * The season report's "Hunting pressure and sits" section on the demo's Kettle Hollow Farm: every
 * stand's row fits the table (no column header or figure broken over lines), and the section keeps
 * its heading with its table. The PDF is kept in tests/.artifacts for a look (pdftoppm → PNG).
 */
import { describe, expect, it } from 'vitest';
import fs from 'node:fs';
import path from 'node:path';
import { seedDemo } from '../../server/db/seeds/demo';
import { Property } from '../../server/models';
import { signedInAgent } from '../support/test-app';
import { binary, textOfPdf } from '../support/firm-settings';

const ARTIFACTS = path.resolve(import.meta.dirname, '../.artifacts');

describe('season report: hunting pressure and sits', () => {
  it('prints one line per stand with every figure, and the heading on the same page as its table', async () => {
    const firm = await seedDemo();
    const property = (await Property.findOne({ where: { firmId: firm.id, name: 'Kettle Hollow Farm' } }))!;
    const consultant = await signedInAgent('consultant@browseline.test', 'demo-browseline');
    // The demo's sits are 1–12 days old; the season (July–June, our convention) of yesterday holds at least one.
    const yesterday = new Date(Date.now() - 86_400_000);
    const season = yesterday.getUTCFullYear() - (yesterday.getUTCMonth() >= 6 ? 0 : 1);
    // A report needs work, a survey or a harvest in its season: the deer taken from the ridge stand yesterday.
    const stands = (await consultant.get(`/api/properties/${property.id}/stand-winds`)).body.data as { unitId: number; name: string }[];
    const ridge = stands.find((s) => s.name === 'Ridge stand')!;
    const harvest = await consultant
      .post(`/api/properties/${property.id}/harvests`)
      .set('X-CSRF-Token', consultant.csrf)
      .send({ date: yesterday.toISOString().slice(0, 10), sex: 'male', ageClass: '3.5', standUnitId: ridge.unitId, diseaseSampleNumber: 'WI-CWD 2026-0417' });
    expect(harvest.status, JSON.stringify(harvest.body)).toBe(201);
    const made = await consultant.post(`/api/properties/${property.id}/season-reports`).set('X-CSRF-Token', consultant.csrf).send({ season });
    expect(made.status, JSON.stringify(made.body)).toBe(201);
    const { status, body: pdf } = await binary(consultant, made.body.data.pdfUrl);
    expect(status).toBe(200);
    fs.mkdirSync(ARTIFACTS, { recursive: true });
    fs.writeFileSync(path.join(ARTIFACTS, 'season-report-pressure.pdf'), pdf);
    const pages = textOfPdf(pdf).split('\f');
    const page = pages.find((p) => p.includes('Hunting pressure and sits'));
    expect(page, 'the section is printed').toBeDefined();
    const lines = page!.split('\n');
    const heading = lines.findIndex((l) => l.includes('Hunting pressure and sits'));
    const header = lines.findIndex((l, i) => i > heading && /Stand\s+Sits\s+Hours\s+Deer seen/.test(l));
    // The table's header is one line (no header cell wrapped onto a second line) on the heading's page.
    expect(header).toBeGreaterThan(heading);
    expect(lines[header]).toMatch(/Stand\s+Sits\s+Hours\s+Deer seen\s+Deer \/ hour\s+On a wrong wind\s+Harvests/);
    // Each demo stand is one row: name, then six figures.
    for (const stand of ['Ridge stand', 'Hollow stand']) {
      const row = lines.find((l) => l.trim().startsWith(stand));
      if (row) expect(row.trim()).toMatch(new RegExp(`^${stand}\\s+\\d+\\s+[\\d.]+\\s+\\d+\\s+([\\d.]+|—)\\s+\\d+\\s+\\d+$`));
    }
    expect(lines.some((l) => /^\s*Ridge stand\s/.test(l))).toBe(true);
  });
});
