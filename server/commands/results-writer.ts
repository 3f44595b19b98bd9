/** Writes camera surveys and harvest records of a property, each in one transaction with its audit row. */
import type { Transaction } from 'sequelize';
import type { z } from 'zod';
import { sequelize } from '../db/sequelize';
import { CameraSurvey, HarvestRecord, Property, Sit, Unit } from '../models';
import { findInFirm } from '../policies/firm-scope';
import { unprocessable } from '../errors';
import { recordAudit } from './audit-recorder';
import { firmToday } from '../services/clock';
import { formatDate } from '../../shared/domain/clock';
import { cameraSurveyEstimates, huntingSeasonOf } from '../../shared/domain/survey-estimates';
import { HarvestCreateSchema, SurveyCreateSchema, type HarvestCreateValues, type HarvestUpdateSchema, type SurveyCreateValues, type SurveyUpdateSchema } from '../../shared/schemas/results';
import type { SessionUser } from '../../shared/schemas/auth';

/** Refuses camera sites that are not camera-site units of this property, naming them. */
async function checkCameraSites(propertyId: number, ids: readonly number[], transaction: Transaction): Promise<void> {
  if (ids.length === 0) return;
  const found = await Unit.findAll({ where: { id: [...ids], propertyId }, attributes: ['id', 'kind', 'name'], transaction });
  const byId = new Map(found.map((u) => [u.id, u]));
  const missing = ids.filter((id) => !byId.has(id));
  if (missing.length > 0) {
    throw unprocessable(`cameraUnitIds: camera site ${missing.join(', ')} is not on this property’s plan. Pick camera sites from this property, or add them on the plan map first.`, [{ path: 'cameraUnitIds', message: 'not on this property' }]);
  }
  const notCameras = found.filter((u) => u.kind !== 'camera-site');
  if (notCameras.length > 0) {
    throw unprocessable(`cameraUnitIds: ${notCameras.map((u) => `“${u.name}”`).join(', ')} ${notCameras.length === 1 ? 'is not a camera site' : 'are not camera sites'}. Pick plan units of kind camera site.`, [{ path: 'cameraUnitIds', message: 'not a camera site' }]);
  }
}

function requireAcres(property: Property): number {
  if (property.acres === null || property.acres <= 0) {
    throw unprocessable('This property has no measured area yet: draw or import its boundary on the plan map, so deer per square mile can be estimated.');
  }
  return property.acres;
}

/** Checks a survey's values against the property and the estimate method (DomainValidationError → 422). */
async function checkSurvey(property: Property, values: SurveyCreateValues, transaction: Transaction): Promise<number> {
  const propertyAcres = requireAcres(property);
  const ids = values.cameraUnitIds ?? [];
  await checkCameraSites(property.id, ids, transaction);
  const cameraCount = values.cameraCount ?? ids.length;
  cameraSurveyEstimates({ ...values, propertyAcres, cameraCount });
  return cameraCount;
}

/** Records a camera survey for a property. */
export async function createSurvey(actor: SessionUser, propertyId: number, values: SurveyCreateValues, ip: string | null): Promise<{ survey: CameraSurvey; property: Property }> {
  return sequelize.transaction(async (transaction) => {
    const property = await findInFirm(Property, propertyId, actor.firmId, 'That property', { transaction });
    const cameraCount = await checkSurvey(property, values, transaction);
    const survey = await CameraSurvey.create(
      {
        firmId: actor.firmId,
        propertyId,
        name: values.name,
        startDate: values.startDate,
        endDate: values.endDate,
        season: huntingSeasonOf(values.startDate, 'startDate'),
        buckPhotos: values.buckPhotos,
        uniqueBucks: values.uniqueBucks,
        doePhotos: values.doePhotos,
        fawnPhotos: values.fawnPhotos,
        bucks: values.bucks ?? [],
        cameraUnitIds: values.cameraUnitIds ?? [],
        cameraCount,
        notes: values.notes ?? null,
        createdById: actor.id,
      },
      { transaction },
    );
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'survey.created', subjectType: 'CameraSurvey', subjectId: survey.id, data: { propertyId }, ip }, transaction);
    return { survey, property };
  });
}

/** Changes a survey; the survey as changed is checked whole. */
export async function updateSurvey(actor: SessionUser, id: number, patch: z.output<typeof SurveyUpdateSchema>, ip: string | null): Promise<{ survey: CameraSurvey; property: Property }> {
  return sequelize.transaction(async (transaction) => {
    const survey = await findInFirm(CameraSurvey, id, actor.firmId, 'That survey', { transaction, lock: true });
    const property = await findInFirm(Property, survey.propertyId, actor.firmId, 'That property', { transaction });
    const idsChanged = patch.cameraUnitIds !== undefined;
    const merged = SurveyCreateSchema.parse({
      name: survey.name,
      startDate: survey.startDate,
      endDate: survey.endDate,
      buckPhotos: survey.buckPhotos,
      uniqueBucks: survey.uniqueBucks,
      doePhotos: survey.doePhotos,
      fawnPhotos: survey.fawnPhotos,
      bucks: survey.bucks,
      cameraUnitIds: survey.cameraUnitIds,
      // Cameras picked anew count themselves unless a number is given with them.
      cameraCount: idsChanged && patch.cameraCount === undefined ? null : survey.cameraCount,
      notes: survey.notes,
      ...Object.fromEntries(Object.entries(patch).filter(([, v]) => v !== undefined)),
    });
    const cameraCount = await checkSurvey(property, merged, transaction);
    await survey.update(
      {
        name: merged.name,
        startDate: merged.startDate,
        endDate: merged.endDate,
        season: huntingSeasonOf(merged.startDate, 'startDate'),
        buckPhotos: merged.buckPhotos,
        uniqueBucks: merged.uniqueBucks,
        doePhotos: merged.doePhotos,
        fawnPhotos: merged.fawnPhotos,
        bucks: merged.bucks ?? [],
        cameraUnitIds: merged.cameraUnitIds ?? [],
        cameraCount,
        notes: merged.notes ?? null,
      },
      { transaction },
    );
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'survey.updated', subjectType: 'CameraSurvey', subjectId: survey.id, data: { fields: Object.keys(patch) }, ip }, transaction);
    return { survey, property };
  });
}

/** Deletes a survey. */
export async function deleteSurvey(actor: SessionUser, id: number, ip: string | null): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const survey = await findInFirm(CameraSurvey, id, actor.firmId, 'That survey', { transaction, lock: true });
    await survey.destroy({ transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'survey.deleted', subjectType: 'CameraSurvey', subjectId: id, data: { propertyId: survey.propertyId, name: survey.name }, ip }, transaction);
  });
}

/** Checks a harvest record against the property: its unit must be on the plan, its date not in the future. */
async function checkHarvest(firmId: number, propertyId: number, values: HarvestCreateValues, transaction: Transaction): Promise<void> {
  if (values.date > (await firmToday(firmId, transaction))) {
    throw unprocessable(`date: ${formatDate(values.date)} is in the future. Enter the day the deer was taken.`, [{ path: 'date', message: 'in the future' }]);
  }
  if (values.unitId) {
    const unit = await Unit.findOne({ where: { id: values.unitId, propertyId }, attributes: ['id'], transaction });
    if (!unit) throw unprocessable('unitId: that unit is not on this property’s plan. Pick a stand or plot of this property, or leave it empty and name the stand.', [{ path: 'unitId', message: 'not on this property' }]);
  }
  if (values.standUnitId) {
    const stand = await Unit.findOne({ where: { id: values.standUnitId, propertyId, kind: 'stand-site' }, attributes: ['id'], transaction });
    if (!stand) throw unprocessable('standUnitId: that is not a stand site of this property. Pick one of its stands, or leave it empty.', [{ path: 'standUnitId', message: 'not a stand site of this property' }]);
  }
  if (values.sitId) {
    const sit = await Sit.findOne({ where: { id: values.sitId, propertyId, firmId }, attributes: ['id', 'standUnitId'], transaction });
    if (!sit) throw unprocessable('sitId: that sit was not logged on this property. Pick one of its sits, or leave it empty.', [{ path: 'sitId', message: 'not a sit of this property' }]);
    if (values.standUnitId && sit.standUnitId !== values.standUnitId) throw unprocessable('sitId: that sit was at another stand. Pick the sit made at this stand, or change the stand.', [{ path: 'sitId', message: 'sit at another stand' }]);
  }
}

/** The stand of a harvest: the one given, else the stand of its sit. */
async function standOf(values: HarvestCreateValues, transaction: Transaction): Promise<number | null> {
  if (values.standUnitId) return values.standUnitId;
  if (!values.sitId) return null;
  return (await Sit.findByPk(values.sitId, { attributes: ['standUnitId'], transaction }))?.standUnitId ?? null;
}

/** Records a harvested deer for a property. */
export async function createHarvest(actor: SessionUser, propertyId: number, values: HarvestCreateValues, ip: string | null): Promise<HarvestRecord> {
  return sequelize.transaction(async (transaction) => {
    await findInFirm(Property, propertyId, actor.firmId, 'That property', { transaction });
    await checkHarvest(actor.firmId, propertyId, values, transaction);
    const record = await HarvestRecord.create(
      {
        firmId: actor.firmId,
        propertyId,
        date: values.date,
        season: huntingSeasonOf(values.date),
        sex: values.sex,
        ageClass: values.ageClass,
        dressedWeightLb: values.dressedWeightLb ?? null,
        antlerPoints: values.antlerPoints ?? null,
        unitId: values.unitId ?? null,
        stand: values.stand ?? null,
        hunter: values.hunter ?? null,
        notes: values.notes ?? null,
        standUnitId: await standOf(values, transaction),
        sitId: values.sitId ?? null,
        diseaseSampleNumber: values.diseaseSampleNumber ?? null,
        createdById: actor.id,
      },
      { transaction },
    );
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'harvest.created', subjectType: 'HarvestRecord', subjectId: record.id, data: { propertyId }, ip }, transaction);
    return record;
  });
}

/** Changes a harvest record; the record as changed is checked whole. */
export async function updateHarvest(actor: SessionUser, id: number, patch: z.output<typeof HarvestUpdateSchema>, ip: string | null): Promise<HarvestRecord> {
  return sequelize.transaction(async (transaction) => {
    const record = await findInFirm(HarvestRecord, id, actor.firmId, 'That harvest record', { transaction, lock: true });
    const merged = HarvestCreateSchema.parse({
      date: record.date,
      sex: record.sex,
      ageClass: record.ageClass,
      dressedWeightLb: record.dressedWeightLb,
      antlerPoints: record.antlerPoints,
      unitId: record.unitId,
      stand: record.stand,
      hunter: record.hunter,
      notes: record.notes,
      standUnitId: record.standUnitId,
      sitId: record.sitId,
      diseaseSampleNumber: record.diseaseSampleNumber,
      ...Object.fromEntries(Object.entries(patch).filter(([, v]) => v !== undefined)),
    });
    await checkHarvest(actor.firmId, record.propertyId, merged, transaction);
    await record.update(
      {
        date: merged.date,
        season: huntingSeasonOf(merged.date),
        sex: merged.sex,
        ageClass: merged.ageClass,
        dressedWeightLb: merged.dressedWeightLb ?? null,
        antlerPoints: merged.antlerPoints ?? null,
        unitId: merged.unitId ?? null,
        stand: merged.stand ?? null,
        hunter: merged.hunter ?? null,
        notes: merged.notes ?? null,
        standUnitId: await standOf(merged, transaction),
        sitId: merged.sitId ?? null,
        diseaseSampleNumber: merged.diseaseSampleNumber ?? null,
      },
      { transaction },
    );
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'harvest.updated', subjectType: 'HarvestRecord', subjectId: id, data: { fields: Object.keys(patch) }, ip }, transaction);
    return record;
  });
}

/** Deletes a harvest record. */
export async function deleteHarvest(actor: SessionUser, id: number, ip: string | null): Promise<void> {
  await sequelize.transaction(async (transaction) => {
    const record = await findInFirm(HarvestRecord, id, actor.firmId, 'That harvest record', { transaction, lock: true });
    await record.destroy({ transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'harvest.deleted', subjectType: 'HarvestRecord', subjectId: id, data: { propertyId: record.propertyId }, ip }, transaction);
  });
}
