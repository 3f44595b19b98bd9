/**
 * Reads a property's results: surveys with their estimates, harvest records and their summary,
 * season reports, and one season's summary (work done, acres established) for the report.
 */
import { Op, type Transaction } from 'sequelize';
import type { SessionUser } from '../../../shared/schemas/auth';
import { CAUTIONS } from '../../../shared/domain/cautions';
import { harvestSummary } from '../../../shared/domain/survey-estimates';
import { acresEstablished, deerSexOf, seasonRange, surveyTrend } from '../../../shared/domain/season-results';
import type { CameraSiteDto, HarvestDto, ResultsDto, SeasonReportDto, SeasonSummaryDto, SurveyDto } from '../../../shared/schemas/results';
import { CameraSurvey, HarvestRecord, Property, SeasonReport, SharedFile, Task, TaskPhoto, Unit } from '../../models';
import { findInFirm } from '../../policies/firm-scope';
import { notFound } from '../../errors';
import { presentHarvest, presentSeasonReport, presentSurvey } from '../../presenters/results';

type Opts = { transaction?: Transaction };

/** A property the person may read: staff of its firm, or the client who owns it (404 otherwise). */
export async function readableProperty(me: SessionUser, propertyId: number, opts: Opts = {}): Promise<Property> {
  const property = await findInFirm(Property, propertyId, me.firmId, 'That property', opts);
  if (me.role === 'client' && property.clientId !== me.clientId) throw notFound('That property');
  if (me.role === 'crew') throw notFound('That property');
  return property;
}

interface PlanUnits {
  cameraSites: CameraSiteDto[];
  units: { id: number; name: string; kind: string; acres: number | null }[];
  names: Map<number, string>;
}

async function planUnits(propertyId: number, opts: Opts): Promise<PlanUnits> {
  const rows = await Unit.findAll({ where: { propertyId }, attributes: ['id', 'name', 'kind', 'acres'], order: [['name', 'ASC']], transaction: opts.transaction });
  const units = rows.map((u) => ({ id: u.id, name: u.name, kind: u.kind, acres: u.acres }));
  return {
    units,
    cameraSites: units.filter((u) => u.kind === 'camera-site').map((u) => ({ id: u.id, name: u.name })),
    names: new Map(units.map((u) => [u.id, u.name])),
  };
}

/** The property's surveys, newest first, with estimates. */
export async function listSurveys(property: Property, opts: Opts = {}, plan?: PlanUnits): Promise<SurveyDto[]> {
  const units = plan ?? (await planUnits(property.id, opts));
  const rows = await CameraSurvey.findAll({ where: { propertyId: property.id }, order: [['startDate', 'DESC'], ['id', 'DESC']], transaction: opts.transaction });
  return rows.map((s) => presentSurvey(s, property.acres, units.cameraSites));
}

/** One survey as the API answers it. */
export async function readSurvey(survey: CameraSurvey, property: Property, opts: Opts = {}): Promise<SurveyDto> {
  const units = await planUnits(property.id, opts);
  return presentSurvey(survey, property.acres, units.cameraSites);
}

/** The property's harvest records, newest first. */
export async function listHarvests(property: Property, opts: Opts = {}, plan?: PlanUnits): Promise<HarvestDto[]> {
  const units = plan ?? (await planUnits(property.id, opts));
  const rows = await HarvestRecord.findAll({ where: { propertyId: property.id }, order: [['date', 'DESC'], ['id', 'DESC']], transaction: opts.transaction });
  return rows.map((h) => presentHarvest(h, units.names));
}

/** The harvest summary (age structure, buck:doe by season) of a list of records. */
export function summariseHarvests(harvests: readonly HarvestDto[]) {
  return harvestSummary(harvests.map((h) => ({ date: h.date, sex: deerSexOf(h.sex), ageClass: h.ageClass, dressedWeightLb: h.dressedWeightLb })));
}

/** The property's season reports, newest first; clients see only the ones sent to them. */
export async function listSeasonReports(me: SessionUser, property: Property, opts: Opts = {}): Promise<SeasonReportDto[]> {
  const where: Record<string | symbol, unknown> = { propertyId: property.id };
  if (me.role === 'client') {
    where.sentAt = { [Op.ne]: null };
    where.withdrawnAt = null;
  }
  const rows = await SeasonReport.findAll({ where, order: [['season', 'DESC'], ['id', 'DESC']], transaction: opts.transaction });
  const files = await SharedFile.findAll({ where: { id: rows.map((r) => r.sharedFileId) }, attributes: ['id', 'byteSize'], transaction: opts.transaction });
  const size = new Map(files.map((f) => [f.id, f.byteSize]));
  return rows.map((r) => presentSeasonReport(r, size.get(r.sharedFileId) ?? 0));
}

/** Everything the Results page shows for one property. */
export async function readResults(me: SessionUser, property: Property): Promise<ResultsDto> {
  const plan = await planUnits(property.id, {});
  const [surveys, harvests, reports] = await Promise.all([listSurveys(property, {}, plan), listHarvests(property, {}, plan), listSeasonReports(me, property)]);
  return {
    property: { id: property.id, name: property.name, acres: property.acres, clientId: property.clientId },
    cameraSites: plan.cameraSites,
    units: plan.units.map(({ id, name, kind }) => ({ id, name, kind })),
    surveys,
    surveyTrend: surveyTrend(surveys),
    harvests,
    harvestSummary: summariseHarvests(harvests),
    reports,
    cautions: [CAUTIONS['deer-scent-baiting']],
  };
}

/** One season's summary plus the finished tasks' photos (for the report). */
export async function readSeasonSummary(property: Property, season: number, opts: Opts = {}): Promise<SeasonSummaryDto & { photos: TaskPhoto[] }> {
  const range = seasonRange(season);
  const plan = await planUnits(property.id, opts);
  const [tasks, surveys, harvests] = await Promise.all([
    Task.findAll({ where: { propertyId: property.id }, attributes: ['id', 'unitId', 'status', 'costCents', 'doneOn', 'name', 'unitName', 'practiceName'], transaction: opts.transaction }),
    listSurveys(property, opts, plan),
    listHarvests(property, opts, plan),
  ]);
  const doneInSeason = tasks
    .filter((t) => t.status === 'done' && t.doneOn && t.doneOn >= range.startsOn && t.doneOn <= range.endsOn)
    .sort((a, b) => (a.doneOn ?? '').localeCompare(b.doneOn ?? '') || a.id - b.id);
  const photos = doneInSeason.length
    ? await TaskPhoto.findAll({ where: { taskId: doneInSeason.map((t) => t.id) }, order: [['createdAt', 'ASC'], ['id', 'ASC']], transaction: opts.transaction })
    : [];
  const established = acresEstablished(
    plan.units,
    tasks.map((t) => ({ unitId: t.unitId, status: t.status, costCents: t.costCents, doneOn: t.doneOn })),
    season,
  );
  const establishedIds = new Set(established.unitIds);
  const seasonSurveys = surveys.filter((s) => s.season === season);
  const seasonHarvests = harvests.filter((h) => h.season === season);
  return {
    season,
    label: range.label,
    startsOn: range.startsOn,
    endsOn: range.endsOn,
    property: { id: property.id, name: property.name, acres: property.acres },
    work: doneInSeason.map((t) => ({ taskId: t.id, name: t.name, unitName: t.unitName, practiceName: t.practiceName, doneOn: t.doneOn ?? '' })),
    photoCount: photos.length,
    acresEstablished: established.acres,
    unitsEstablished: plan.units.filter((u) => establishedIds.has(u.id)),
    surveys: seasonSurveys,
    harvests: seasonHarvests,
    harvestSummary: summariseHarvests(seasonHarvests),
    // Season over season up to this one, so last season's report does not show next year's figures.
    surveyTrend: surveyTrend(surveys).filter((row) => row.season <= season),
    harvestTrend: summariseHarvests(harvests.filter((h) => h.season <= season)).seasons,
    photos,
  };
}
