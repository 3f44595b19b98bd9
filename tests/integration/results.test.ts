import { beforeAll, describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import { encode } from 'fast-png';
import { capturedMailTo, capturedMessage, signedInAgent, type Agent } from '../support/test-app';
import { deliverAllMail } from '../support/test-app';
import { makeClient, makeFirm, makeProperty, makeUser, PASSWORD } from '../support/factories';
import { rectangle } from '../support/geodesy';
import { binary, send, textOfPdf } from '../support/firm-settings';
import { OutboxMessage, Property, SeasonReport, SharedFile, Task, TaskPhoto } from '../../server/models';
import { saveFile } from '../../server/services/storage/storage';
import { SurveyCreateSchema } from '../../shared/schemas/results';

let ctx: Awaited<ReturnType<typeof makeFirm>>;
let consultant: Agent;
let client: Agent;
let crew: Agent;
let propertyId: number;
let cameraIds: number[];
let plotId: number;


// Tallies built to reproduce the published example (SEDSG 1993 abstract, REFERENCES.md):
// 10,000 acres, 213 bucks, buck:doe 1:1.4, doe:fawn 1:0.67 → 711 deer ≈ 45.5 per mi².
// 5 photos per buck: 213 × 5 = 1,065 buck photos; does 213 × 1.4 = 298.2 → 1,491 doe photos;
// fawns 298.2 × 0.67 ≈ 199.8 → 999 fawn photos (worked by hand, as in the unit test).
// 100 cameras = one per 100 acres for 14 days (Jacobson et al. 1997, from memory): no warning.
const sedsg = {
  name: 'SEDSG worked example',
  startDate: '2024-08-01',
  endDate: '2024-08-14',
  buckPhotos: 1_065,
  uniqueBucks: 213,
  doePhotos: 1_491,
  fawnPhotos: 999,
  cameraCount: 100,
};

beforeAll(async () => {
  ctx = await makeFirm();
  consultant = await signedInAgent(ctx.users.consultant.email, PASSWORD);
  client = await signedInAgent(ctx.users.client.email, PASSWORD);
  crew = await signedInAgent(ctx.users.crew.email, PASSWORD);
  const property = await makeProperty(ctx.firm.id, ctx.client.id);
  // The example's 10,000 acres, set directly so deer per mi² divides by exactly 15.625 mi².
  await Property.update({ acres: 10_000 }, { where: { id: property.id } });
  propertyId = property.id;
  const cams = [];
  for (const [i, lon] of [-90.938, -90.934].entries()) {
    const res = await send(consultant, 'post', `/api/properties/${propertyId}/units`, { kind: 'camera-site', name: `Camera ${i + 1}`, geometry: { type: 'Point', coordinates: [lon, 43.267] } });
    expect(res.status).toBe(201);
    cams.push(res.body.data.id as number);
  }
  cameraIds = cams;
  const plot = await send(consultant, 'post', `/api/properties/${propertyId}/units`, { kind: 'food-plot', name: 'Hollow plot', geometry: rectangle(-90.937, 43.2665, 120, 80) });
  expect(plot.status).toBe(201);
  plotId = plot.body.data.id;
});

describe('camera surveys', () => {
  it('answers the SEDSG 1993 worked example with its estimates (201)', async () => {
    const res = await send(consultant, 'post', `/api/properties/${propertyId}/surveys`, { ...sedsg, cameraUnitIds: cameraIds });
    expect(res.status).toBe(201);
    const { estimates, display, warnings, cameras } = res.body.data;
    expect(estimates.bucks).toBe(213); // SEDSG 1993 abstract
    expect(Math.abs(estimates.total - 711)).toBeLessThanOrEqual(0.5); // SEDSG 1993 abstract: 711 deer
    expect(Math.abs(estimates.buckDoeRatio - 1.4)).toBeLessThanOrEqual(0.05); // SEDSG 1993 abstract: buck:doe 1:1.4
    expect(Math.abs(estimates.fawnDoeRatio - 0.67)).toBeLessThanOrEqual(0.005); // SEDSG 1993 abstract: doe:fawn 1:0.67
    expect(Math.abs(estimates.deerPerSqMi - 45.5)).toBeLessThanOrEqual(0.05); // REFERENCES.md: 711 deer on 10,000 acres ≈ 45.5 per mi²
    expect(Math.round(estimates.does)).toBe(298); // 1,491 ÷ 5, worked by hand
    expect(Math.round(estimates.fawns)).toBe(200); // 999 ÷ 5 = 199.8, worked by hand
    expect(display).toMatchObject({ total: '711', buckDoeRatio: '1:1.4', fawnDoeRatio: '0.67', deerPerSqMi: '45.5' }); // SEDSG 1993 abstract, rounded as printed
    // One camera per 100 acres for 14 days meets the method (Jacobson et al. 1997, from memory): only the two notes.
    expect(warnings.map((w: { code: string }) => w.code)).toEqual(['method-undercounts', 'baiting-rules']);
    expect(warnings[0].message).toMatch(/undercount/);
    expect(warnings[1].message).toMatch(/illegal in some states/); // REFERENCES.md: baiting for surveys is illegal in some states
    expect(cameras.map((c: { name: string }) => c.name)).toEqual(['Camera 1', 'Camera 2']);

    const again = await consultant.get(`/api/surveys/${res.body.data.id}`);
    expect(again.status).toBe(200);
    expect(again.body.data.estimates).toEqual(estimates);
  });

  it('warns about too few cameras and a survey shorter than 10 days', async () => {
    // Two cameras on 10,000 acres is one per 5,000 acres; Aug 1–7 is 7 days (Jacobson et al. 1997, from memory: ~1 per 100 acres, 10–14 days).
    const res = await send(consultant, 'post', `/api/properties/${propertyId}/surveys`, { ...sedsg, name: 'Short and sparse', endDate: '2024-08-07', cameraCount: undefined, cameraUnitIds: cameraIds });
    expect(res.status).toBe(201);
    const codes = res.body.data.warnings.map((w: { code: string }) => w.code);
    expect(codes).toEqual(expect.arrayContaining(['camera-density-low', 'survey-short', 'method-undercounts', 'baiting-rules']));
    expect(res.body.data.cameraCount).toBe(2);
    expect(res.body.data.surveyDays).toBe(7); // Aug 1 through Aug 7, both counted
  });

  it('refuses impossible tallies with 422 and a sentence naming the field', async () => {
    const url = `/api/properties/${propertyId}/surveys`;
    const cases: [Record<string, unknown>, RegExp][] = [
      [{ uniqueBucks: 0 }, /uniqueBucks: enter at least one buck/],
      [{ doePhotos: -4 }, /Doe photos cannot be negative/],
      [{ buckPhotos: -1 }, /Buck photos cannot be negative/],
      [{ uniqueBucks: 1_066 }, /cannot be more than buck photos/],
      [{ fawnPhotos: 2.5 }, /Fawn photos: enter a whole number/],
      [{ endDate: '2024-07-30' }, /ends \(Jul 30, 2024\) before it starts/],
      [{ bucks: [{ label: 'Split G2', ageClass: '3.5' }] }, /one entry per unique buck/],
      [{ cameraCount: undefined }, /pick the camera sites used, or enter how many cameras ran/],
    ];
    for (const [change, message] of cases) {
      const res = await send(consultant, 'post', url, { ...sedsg, ...change });
      expect(res.status, JSON.stringify(change)).toBe(422);
      expect(res.body.error).toMatch(message);
    }
  });

  it('accepts identified bucks, one per unique buck, and refuses camera sites not on the property', async () => {
    const ok = await send(consultant, 'post', `/api/properties/${propertyId}/surveys`, {
      ...sedsg,
      name: 'Three bucks',
      buckPhotos: 9,
      uniqueBucks: 3,
      doePhotos: 12,
      fawnPhotos: 6,
      bucks: [
        { label: 'Tall tines', ageClass: '4.5' },
        { label: 'Kicker', ageClass: '3.5' },
        { label: 'Spike', ageClass: '1.5' },
      ],
    });
    expect(ok.status).toBe(201);
    // Worked by hand: 9 ÷ 3 = 3 photos per buck; 12 ÷ 3 = 4 does; 6 ÷ 3 = 2 fawns; 9 deer.
    expect(ok.body.data.estimates).toMatchObject({ photosPerBuck: 3, does: 4, fawns: 2, total: 9 });

    const other = await makeProperty(ctx.firm.id, ctx.client.id);
    const farCam = await send(consultant, 'post', `/api/properties/${other.id}/units`, { kind: 'camera-site', name: 'Elsewhere', geometry: { type: 'Point', coordinates: [-90.935, 43.267] } });
    const wrong = await send(consultant, 'post', `/api/properties/${propertyId}/surveys`, { ...sedsg, cameraUnitIds: [farCam.body.data.id] });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error).toMatch(/not on this property’s plan/);
    const notCamera = await send(consultant, 'post', `/api/properties/${propertyId}/surveys`, { ...sedsg, cameraUnitIds: [plotId] });
    expect(notCamera.status).toBe(422);
    expect(notCamera.body.error).toMatch(/“Hollow plot” is not a camera site/);
  });

  it('changes a survey and checks it whole; deletes it', async () => {
    const made = await send(consultant, 'post', `/api/properties/${propertyId}/surveys`, { ...sedsg, name: 'To change' });
    const id = made.body.data.id;
    const bad = await send(consultant, 'patch', `/api/surveys/${id}`, { uniqueBucks: 2_000 });
    expect(bad.status).toBe(422);
    expect(bad.body.error).toMatch(/cannot be more than buck photos/);
    const good = await send(consultant, 'patch', `/api/surveys/${id}`, { buckPhotos: 2_130 });
    expect(good.status).toBe(200);
    expect(good.body.data.estimates.photosPerBuck).toBe(10); // 2,130 ÷ 213, worked by hand
    expect(good.body.data.estimates.does).toBeCloseTo(149.1, 9); // 1,491 ÷ 10, worked by hand
    expect((await send(client, 'delete', `/api/surveys/${id}`)).status).toBe(403);
    expect((await send(consultant, 'delete', `/api/surveys/${id}`)).status).toBe(204);
    expect((await consultant.get(`/api/surveys/${id}`)).status).toBe(404);
  });

  it('lets the property’s client read its surveys and no one else’s', async () => {
    const list = await client.get(`/api/properties/${propertyId}/surveys`);
    expect(list.status).toBe(200);
    expect(list.body.data.length).toBeGreaterThan(0);
    expect((await client.get(`/api/surveys/${list.body.data[0].id}`)).status).toBe(200);
    expect((await send(client, 'post', `/api/properties/${propertyId}/surveys`, sedsg)).status).toBe(403);
    expect((await crew.get(`/api/surveys/${list.body.data[0].id}`)).status).toBe(403);

    // Another client of the same firm, and a consultant of another firm, get 404.
    const neighbour = await makeClient(ctx.firm.id);
    const neighbourUser = await makeUser(ctx.firm.id, 'client', neighbour.id);
    const nosy = await signedInAgent(neighbourUser.email, PASSWORD);
    expect((await nosy.get(`/api/surveys/${list.body.data[0].id}`)).status).toBe(404);
    expect((await nosy.get(`/api/properties/${propertyId}/results`)).status).toBe(404);
    const otherFirm = await makeFirm();
    const stranger = await signedInAgent(otherFirm.users.consultant.email, PASSWORD);
    expect((await stranger.get(`/api/surveys/${list.body.data[0].id}`)).status).toBe(404);
    expect((await send(stranger, 'post', `/api/properties/${propertyId}/surveys`, sedsg)).status).toBe(404);
  });

  it('the shared schema the form uses refuses the same impossible tallies', () => {
    expect(SurveyCreateSchema.safeParse({ ...sedsg, uniqueBucks: 0 }).success).toBe(false);
    expect(SurveyCreateSchema.safeParse({ ...sedsg, uniqueBucks: 1_066 }).success).toBe(false);
    expect(SurveyCreateSchema.safeParse(sedsg).success).toBe(true);
  });
});

describe('harvest records', () => {
  // Invented records over two seasons (July–June).
  const records = [
    { date: '2023-11-18', sex: 'male', ageClass: '3.5', dressedWeightLb: 150, antlerPoints: 8 },
    { date: '2023-11-25', sex: 'female', ageClass: '2.5', dressedWeightLb: 95 },
    { date: '2024-01-06', sex: 'female', ageClass: '3.5', dressedWeightLb: 105 },
    { date: '2024-11-09', sex: 'male', ageClass: '5.5+', antlerPoints: 10 },
    { date: '2024-11-10', sex: 'female', ageClass: '3.5' },
    { date: '2024-12-14', sex: 'female', ageClass: 'fawn', dressedWeightLb: 40 },
  ];

  it('records harvests and summarises the age structure and buck:doe by season', async () => {
    for (const r of records) {
      const res = await send(consultant, 'post', `/api/properties/${propertyId}/harvests`, { ...r, unitId: plotId, stand: 'Hollow ladder' });
      expect(res.status).toBe(201);
      expect(res.body.data).toMatchObject({ sex: r.sex, ageClass: r.ageClass, unitName: 'Hollow plot' });
    }
    const res = await client.get(`/api/properties/${propertyId}/results`);
    expect(res.status).toBe(200);
    const summary = res.body.data.harvestSummary;
    expect(summary).toMatchObject({ total: 6, bucks: 2, does: 4 }); // counted by hand
    const byClass = Object.fromEntries(summary.ageClasses.map((c: { ageClass: string; bucks: number; does: number }) => [c.ageClass, [c.bucks, c.does]]));
    // Counted by hand; classes fawn, 1½ … 5½+ (Texas A&M AgriLife).
    expect(byClass).toEqual({ fawn: [0, 1], '1.5': [0, 0], '2.5': [0, 1], '3.5': [1, 2], '4.5': [0, 0], '5.5+': [1, 0] });
    // 2023–24: 1 adult buck, 2 adult does → 1:2.0; 2024–25: 1 adult buck, 1 adult doe (the doe fawn is left out) → 1:1.0. Counted by hand.
    expect(summary.seasons.map((s: { label: string; buckDoeRatio: string }) => [s.label, s.buckDoeRatio])).toEqual([
      ['2023–24', '1:2.0'],
      ['2024–25', '1:1.0'],
    ]);
    expect(res.body.data.cautions.map((c: { id: string }) => c.id)).toContain('deer-scent-baiting');
    expect(res.body.data.surveyTrend.length).toBe(1);
  });

  it('refuses bad harvest records with 422 and what to change', async () => {
    const url = `/api/properties/${propertyId}/harvests`;
    const base = { date: '2024-11-02', sex: 'male', ageClass: '2.5' };
    const cases: [Record<string, unknown>, RegExp][] = [
      [{ sex: 'buck' }, /sex must be male or female/],
      [{ ageClass: '6.5' }, /age class must be one of fawn, 1.5, 2.5, 3.5, 4.5, 5.5\+/],
      [{ sex: 'female', antlerPoints: 4 }, /antler points are for bucks/],
      [{ dressedWeightLb: -3 }, /dressed weight must be more than 0 lb/],
      [{ date: '2999-11-02' }, /is in the future/],
      [{ date: '2024-02-30' }, /not a real calendar date/],
    ];
    for (const [change, message] of cases) {
      const res = await send(consultant, 'post', url, { ...base, ...change });
      expect(res.status, JSON.stringify(change)).toBe(422);
      expect(res.body.error).toMatch(message);
    }
    const other = await makeProperty(ctx.firm.id, ctx.client.id);
    const foreign = await send(consultant, 'post', `/api/properties/${other.id}/harvests`, { ...base, unitId: plotId });
    expect(foreign.status).toBe(422);
    expect(foreign.body.error).toMatch(/not on this property’s plan/);
  });

  it('lets staff change and delete a record, never the client', async () => {
    const made = await send(consultant, 'post', `/api/properties/${propertyId}/harvests`, { date: '2024-10-05', sex: 'male', ageClass: '1.5' });
    const id = made.body.data.id;
    const changed = await send(consultant, 'patch', `/api/harvests/${id}`, { ageClass: '2.5', dressedWeightLb: 120.5 });
    expect(changed.status).toBe(200);
    expect(changed.body.data).toMatchObject({ ageClass: '2.5', dressedWeightLb: 120.5 });
    expect((await send(consultant, 'patch', `/api/harvests/${id}`, { sex: 'female', antlerPoints: 3 })).status).toBe(422);
    expect((await send(client, 'patch', `/api/harvests/${id}`, { ageClass: '3.5' })).status).toBe(403);
    expect((await send(client, 'delete', `/api/harvests/${id}`)).status).toBe(403);
    expect((await send(consultant, 'delete', `/api/harvests/${id}`)).status).toBe(204);
  });
});

describe('season summary and report', () => {
  let reportId: number;

  beforeAll(async () => {
    // Finished work on the plot in the 2024–25 season, with a photo (the schedule's tables, written directly).
    const base = { firmId: ctx.firm.id, propertyId, unitId: plotId, prescriptionId: null, proposalId: null, kind: 'planting', practiceName: 'Fall brassica plot', unitName: 'Hollow plot', earliest: '2024-08-01', latest: '2024-09-15', startDate: null, endDate: null, assigneeId: null };
    const sow = await Task.create({ ...base, stepKey: 'sow', name: 'Sow the brassica blend', status: 'done', doneOn: '2024-08-20', costCents: 30_000 });
    await Task.create({ ...base, stepKey: 'lime', name: 'Spread lime', status: 'done', doneOn: '2024-08-10', costCents: 20_000 });
    const png = Buffer.from(encode({ width: 4, height: 3, data: new Uint8Array(36).fill(120), channels: 3 }));
    const storageKey = await saveFile('photos', png, 'png');
    await TaskPhoto.create({ firmId: ctx.firm.id, taskId: sow.id, storageKey, originalName: 'plot.png', contentType: 'image/png', byteSize: png.length, latitude: null, longitude: null, takenAt: null, uploadedById: null });
  });

  it('sums the acres of units whose work is all done in the season', async () => {
    const res = await client.get(`/api/properties/${propertyId}/seasons/2024`);
    expect(res.status).toBe(200);
    const plot = await consultant.get(`/api/units/${plotId}`);
    const plotAcres = plot.body.data.acres ?? plot.body.data.properties?.acres;
    expect(res.body.data).toMatchObject({ label: '2024–25', startsOn: '2024-07-01', endsOn: '2025-06-30', photoCount: 1 }); // July–June season, our convention
    expect(res.body.data.work.map((w: { name: string }) => w.name)).toEqual(['Spread lime', 'Sow the brassica blend']); // in the order finished
    expect(res.body.data.acresEstablished).toBeCloseTo(plotAcres, 6);
    // 120 m × 80 m = 9,600 m² = 2.372 acres (NIST: 1 acre = 4,046.8564224 m²); turf on a sphere, allow 0.5 %.
    expect(Math.abs(res.body.data.acresEstablished - 9_600 / 4_046.8564224) / (9_600 / 4_046.8564224)).toBeLessThan(0.005);
    const before = await client.get(`/api/properties/${propertyId}/seasons/2023`);
    expect(before.body.data.acresEstablished).toBe(0);
    expect((await client.get(`/api/properties/${propertyId}/seasons/1800`)).status).toBe(422);
  });

  it('makes the PDF, keeps it private until sent, then e-mails it and opens it to the client', async () => {
    const made = await send(consultant, 'post', `/api/properties/${propertyId}/season-reports`, { season: 2024, recommendations: 'Take two more adult does.\n\nFrost-seed clover into the hollow plot in March.' });
    expect(made.status).toBe(201);
    reportId = made.body.data.id;
    expect(made.body.data).toMatchObject({ season: 2024, seasonLabel: '2024–25', sentAt: null, pdfUrl: `/api/season-reports/${reportId}/pdf` });

    const pdf = await binary(consultant, made.body.data.pdfUrl);
    expect(pdf.status).toBe(200);
    expect(pdf.body.subarray(0, 5).toString()).toBe('%PDF-');
    const text = textOfPdf(pdf.body);
    for (const expected of ['Work done this season', 'Sow the brassica blend', 'Camera surveys', 'Estimated deer by season', 'Age structure of the harvest', 'Recommendations for next season', 'Take two more adult does', 'baiting and feeding']) {
      expect(text).toContain(expected);
    }
    expect(text).toMatch(/2\.3\d acres\s+established this season/);
    expect(text).toMatch(/1:1\.4/); // SEDSG 1993 abstract, as printed in the survey table
    const images = execFileSync('pdfimages', ['-list', '-'], { input: pdf.body }).toString();
    expect(images.split('\n').filter((l) => /^\s+\d+\s+\d+\s+image/.test(l)).length).toBe(1); // the one task photo

    const file = await SharedFile.findOne({ where: { propertyId, category: 'season-report' } });
    expect(file?.visibleToClient).toBe(false);
    expect((await binary(client, made.body.data.pdfUrl)).status).toBe(404);
    expect((await client.get(`/api/properties/${propertyId}/season-reports`)).body.data).toEqual([]);

    const sent = await send(consultant, 'post', `/api/season-reports/${reportId}/send`);
    expect(sent.status).toBe(200);
    expect(sent.body.data.sentTo).toEqual([ctx.users.client.email]);
    const message = await OutboxMessage.findOne({ where: { kind: 'season-report-sent', toAddress: ctx.users.client.email } });
    expect(message?.attachments[0]).toMatchObject({ filename: 'season-report-2024.pdf', contentType: 'application/pdf' });
    await file!.reload();
    expect(file!.visibleToClient).toBe(true);
    expect((await binary(client, made.body.data.pdfUrl)).status).toBe(200);
    expect((await client.get(`/api/properties/${propertyId}/season-reports`)).body.data.map((r: { id: number }) => r.id)).toEqual([reportId]);

    await deliverAllMail();
    const mail = await capturedMailTo(ctx.users.client.email);
    const full = await capturedMessage(mail.find((m) => m.subject.startsWith('Season report 2024–25'))!.id);
    expect(full.attachments.map((a) => a.filename)).toEqual(['season-report-2024.pdf']);
    expect(full.text).toContain(`/portal/properties/${propertyId}/results`);
  });

  it('keeps reports from the crew, other clients and other firms', async () => {
    expect((await binary(crew, `/api/season-reports/${reportId}/pdf`)).status).toBe(403);
    const otherFirm = await makeFirm();
    const stranger = await signedInAgent(otherFirm.users.client.email, PASSWORD);
    expect((await binary(stranger, `/api/season-reports/${reportId}/pdf`)).status).toBe(404);
    const strangerStaff = await signedInAgent(otherFirm.users.consultant.email, PASSWORD);
    expect((await send(strangerStaff, 'post', `/api/season-reports/${reportId}/send`)).status).toBe(404);
    expect((await send(client, 'post', `/api/season-reports/${reportId}/send`)).status).toBe(403);
  });

  it('refuses a season with no finished work, survey or harvest, saying what to do', async () => {
    const before = await SeasonReport.count({ where: { propertyId } });
    const res = await send(consultant, 'post', `/api/properties/${propertyId}/season-reports`, { season: 2019 });
    expect(res.status).toBe(422);
    expect(res.body.error).toBe('There is nothing to report for the 2019–20 season yet: no finished work, camera survey or harvest record falls in it. Record one, or pick another season, then make the report.');
    expect(await SeasonReport.count({ where: { propertyId } })).toBe(before);
  });

  it('replaces an unsent report when the season is made again, and never a sent one', async () => {
    const first = await send(consultant, 'post', `/api/properties/${propertyId}/season-reports`, { season: 2023, recommendations: 'First draft.' });
    expect(first.status).toBe(201);
    const firstFile = await SharedFile.findOne({ where: { id: (await SeasonReport.findByPk(first.body.data.id))!.sharedFileId } });
    const again = await send(consultant, 'post', `/api/properties/${propertyId}/season-reports`, { season: 2023, recommendations: 'Second draft.' });
    expect(again.status).toBe(201);
    const rows = await SeasonReport.findAll({ where: { propertyId, season: 2023 } });
    expect(rows.map((r) => r.id)).toEqual([again.body.data.id]);
    expect(await SharedFile.count({ where: { propertyId, category: 'season-report', title: firstFile!.title } })).toBe(1);
    expect(await SharedFile.findByPk(firstFile!.id)).toBeNull();
    // The sent 2024–25 report stays when 2024 is made again; the new one is added beside it.
    await send(consultant, 'post', `/api/properties/${propertyId}/season-reports`, { season: 2024 }).expect(201);
    expect(await SeasonReport.findByPk(reportId)).not.toBeNull();
    // The list never holds two unsent reports of one season.
    const list = (await consultant.get(`/api/properties/${propertyId}/season-reports`)).body.data as { season: number; sentAt: string | null }[];
    const unsent = list.filter((r) => r.sentAt === null).map((r) => r.season);
    expect(new Set(unsent).size).toBe(unsent.length);
  });

  it('withdraws a sent report from the portal: the client no longer lists or opens it; sending again brings it back', async () => {
    const pdfUrl = `/api/season-reports/${reportId}/pdf`;
    expect((await binary(client, pdfUrl)).status).toBe(200);
    expect((await send(client, 'post', `/api/season-reports/${reportId}/withdraw`)).status).toBe(403);
    const res = await send(consultant, 'post', `/api/season-reports/${reportId}/withdraw`);
    expect(res.status).toBe(200);
    expect(res.body.data.withdrawnAt).not.toBeNull();
    expect((await binary(client, pdfUrl)).status).toBe(404);
    expect((await client.get(`/api/properties/${propertyId}/season-reports`)).body.data.map((r: { id: number }) => r.id)).not.toContain(reportId);
    const file = await SharedFile.findByPk((await SeasonReport.findByPk(reportId))!.sharedFileId);
    expect(file!.visibleToClient).toBe(false);
    expect((await client.get('/api/files')).body.data.map((f: { id: number }) => f.id)).not.toContain(file!.id);
    // Twice is a 409 with a sentence; the staff still read it.
    const twice = await send(consultant, 'post', `/api/season-reports/${reportId}/withdraw`);
    expect(twice.status).toBe(409);
    expect(twice.body.error).toMatch(/already withdrawn/);
    expect((await binary(consultant, pdfUrl)).status).toBe(200);
    await send(consultant, 'post', `/api/season-reports/${reportId}/send`).expect(200);
    expect((await binary(client, pdfUrl)).status).toBe(200);
  });

  it('refuses a season that is not a year', async () => {
    const res = await send(consultant, 'post', `/api/properties/${propertyId}/season-reports`, { season: 'last year' });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/season: enter the year the season starts/);
  });
});
