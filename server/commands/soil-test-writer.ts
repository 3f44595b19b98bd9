/**
 * Writes soil tests of a unit with the lime and fertilizer recommendation worked by the firm's state
 * method (shared/domain/soil-tests), imports a lab's CSV by unit name (all rows or none), and writes
 * a test's recommendation into the unit's prescription. Each write is one transaction with its audit.
 */
import type { Transaction } from 'sequelize';
import { parse } from 'csv-parse/sync';
import { ZodError } from 'zod';
import { sequelize } from '../db/sequelize';
import { Firm, Material, Practice, Prescription, Property, Unit } from '../models';
import { SoilTest } from '../models/soil-test';
import { findInFirm } from '../policies/firm-scope';
import { unprocessable } from '../errors';
import { recordAudit } from './audit-recorder';
import { computePrescriptionRecord } from './prescription-writer';
import { DomainValidationError } from '../../shared/domain/errors';
import { cropGroupOf, LIME_METHODS, limeRecommendation, nutrientRecommendation, retestDue, TARGET_PH, type BufferMethod, type LimeMethod } from '../../shared/domain/soil-tests';
import { SOIL_CSV_MAX_ROWS, SoilTestCreateSchema, type SoilTestCreateValues } from '../../shared/schemas/soil-tests';
import type { PrescriptionParameters } from '../../shared/domain/practice';
import type { SessionUser } from '../../shared/schemas/auth';
import { formatDate } from '../../shared/domain/clock';

/** Default years between soil tests when the firm has not set `soilRetestYears` (common practice, no source). */
export const DEFAULT_RETEST_YEARS = 3;

/** The firm's lime method: its `limeMethod` setting, else by region (south and mid-south: NCDA&CS; elsewhere: Missouri). */
export function limeMethodFor(settings: Record<string, unknown>, region: string | null): LimeMethod {
  const chosen = settings.limeMethod;
  if (typeof chosen === 'string' && (LIME_METHODS as readonly string[]).includes(chosen)) return chosen as LimeMethod;
  return region === 'south' || region === 'midsouth' ? 'ncdacs' : 'missouri';
}

/** The firm's retest interval in years. */
export function retestYearsFor(settings: Record<string, unknown>): number {
  const years = settings.soilRetestYears;
  return typeof years === 'number' && Number.isInteger(years) && years >= 1 && years <= 10 ? years : DEFAULT_RETEST_YEARS;
}

interface UnitContext {
  prescription: Prescription | null;
  practice: Practice | null;
  cropGroup: string;
  limeEnmLbPerTon: number;
}

/** The unit's latest prescription, the crop group it sows and the ENM of its lime. */
async function unitContext(unit: Unit, transaction: Transaction): Promise<UnitContext> {
  const prescription = await Prescription.findOne({ where: { unitId: unit.id }, order: [['year', 'DESC'], ['id', 'DESC']], transaction });
  const practice = prescription ? await Practice.findByPk(prescription.practiceId, { transaction }) : null;
  const seedKeys = practice?.definition.steps.flatMap((s) => (s.application?.type === 'seed' ? s.application.components.map((c) => c.materialKey) : [])) ?? [];
  const limeStep = practice?.definition.steps.find((s) => s.application?.type === 'lime');
  const keys = [...seedKeys, ...(limeStep?.application?.type === 'lime' ? [limeStep.application.materialKey] : [])];
  const materials = keys.length ? await Material.findAll({ where: { firmId: unit.firmId, key: keys }, transaction }) : [];
  const species = materials.map((m) => (m.definition.type === 'seed' ? m.definition.species : '')).filter(Boolean);
  const lime = materials.find((m) => m.definition.type === 'lime');
  const enm = lime?.definition.type === 'lime' ? lime.definition.enmLbPerTon : undefined;
  return { prescription, practice, cropGroup: cropGroupOf(species), limeEnmLbPerTon: enm ?? 400 };
}

async function writeOne(actor: SessionUser, unit: Unit, values: SoilTestCreateValues, transaction: Transaction): Promise<SoilTest> {
  const firm = await Firm.findByPk(actor.firmId, { attributes: ['settings', 'region'], transaction });
  const property = await Property.findByPk(unit.propertyId, { attributes: ['region'], transaction });
  const settings = (firm?.settings ?? {}) as Record<string, unknown>;
  const method = limeMethodFor(settings, property?.region ?? firm?.region ?? null);
  const context = await unitContext(unit, transaction);
  const target = TARGET_PH[context.cropGroup] ?? TARGET_PH.grain!;
  const test = { ...values, bufferMethod: (values.bufferMethod ?? null) as BufferMethod | null };
  const lime = limeRecommendation(method, test, target.ph, context.limeEnmLbPerTon);
  const nutrients = nutrientRecommendation(test, context.cropGroup);
  return SoilTest.create(
    {
      firmId: actor.firmId,
      propertyId: unit.propertyId,
      unitId: unit.id,
      sampledOn: values.sampledOn,
      lab: values.lab,
      ph: values.ph,
      bufferPh: values.bufferPh ?? null,
      bufferMethod: values.bufferMethod ?? null,
      pPpm: values.pPpm ?? null,
      kPpm: values.kPpm ?? null,
      organicMatterPct: values.organicMatterPct ?? null,
      cec: values.cec ?? null,
      enmLbPerAcre: values.enmLbPerAcre ?? null,
      cropGroup: context.cropGroup,
      recommendation: { lime: { ...lime, source: `${lime.source}; target pH ${target.ph} (${target.source})` }, nutrients },
      retestDue: retestDue(values.sampledOn, retestYearsFor(settings)),
      appliedPrescriptionId: null,
      createdById: actor.id,
    },
    { transaction },
  );
}

/** Stores one soil test of a unit with its recommendation. */
export async function createSoilTest(actor: SessionUser, unitId: number, values: SoilTestCreateValues, ip: string | null): Promise<SoilTest> {
  return sequelize.transaction(async (transaction) => {
    const unit = await findInFirm(Unit, unitId, actor.firmId, 'That unit', { transaction });
    const row = await writeOne(actor, unit, values, transaction);
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'soil-test.recorded', subjectType: 'Unit', subjectId: unit.id, data: { soilTestId: row.id }, ip }, transaction);
    return row;
  });
}

const NUMERIC = ['ph', 'bufferPh', 'pPpm', 'kPpm', 'organicMatterPct', 'cec', 'enmLbPerAcre'] as const;

/** Imports a lab's CSV (header row; a `unit` column naming plan units of the property): every row is stored, or none. */
export async function importSoilTests(actor: SessionUser, propertyId: number, csv: string, ip: string | null): Promise<SoilTest[]> {
  let records: Record<string, string>[];
  try {
    records = parse(csv, { columns: (header: string[]) => header.map((h) => h.trim()), skip_empty_lines: true, trim: true, bom: true }) as Record<string, string>[];
  } catch (error) {
    throw unprocessable(`csv: the file could not be read as CSV (${(error as Error).message}). Save it from the spreadsheet as "CSV UTF-8" with a header row.`);
  }
  if (records.length === 0) throw unprocessable('csv: no rows under the header. Put one soil test per row with a "unit" column.');
  if (records.length > SOIL_CSV_MAX_ROWS) throw unprocessable(`csv: at most ${SOIL_CSV_MAX_ROWS} rows at a time (got ${records.length}).`);
  return sequelize.transaction(async (transaction) => {
    await findInFirm(Property, propertyId, actor.firmId, 'That property', { transaction });
    const units = await Unit.findAll({ where: { propertyId, firmId: actor.firmId }, transaction });
    const byName = new Map(units.map((u) => [u.name.trim().toLowerCase(), u]));
    const rows: SoilTest[] = [];
    for (const [i, record] of records.entries()) {
      const line = i + 2;
      const unit = byName.get((record.unit ?? '').trim().toLowerCase());
      if (!unit) throw unprocessable(`csv row ${line}, unit: “${record.unit ?? ''}” is not a unit of this property. Use the unit names on the plan map.`, [{ path: `rows.${line}.unit`, message: 'not on this property' }]);
      const body: Record<string, unknown> = { sampledOn: record.sampledOn, lab: record.lab, bufferMethod: record.bufferMethod || null };
      for (const key of NUMERIC) {
        const text = record[key];
        body[key] = text === undefined || text === '' ? null : Number(text);
      }
      if (body.ph === null) delete body.ph;
      const parsed = SoilTestCreateSchema.safeParse(body);
      if (!parsed.success) {
        const issue = parsed.error.issues[0]!;
        throw unprocessable(`csv row ${line}, ${issue.path.join('.') || 'row'}: ${issue.message}.`, [{ path: `rows.${line}.${issue.path.join('.')}`, message: issue.message }]);
      }
      try {
        rows.push(await writeOne(actor, unit, parsed.data, transaction));
      } catch (error) {
        if (error instanceof DomainValidationError) throw unprocessable(`csv row ${line}, ${error.field}: ${error.message}`, [{ path: `rows.${line}.${error.field}`, message: error.message }]);
        if (error instanceof ZodError) throw unprocessable(`csv row ${line}: ${error.issues[0]?.message ?? 'not valid'}.`);
        throw error;
      }
    }
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'soil-test.imported', subjectType: 'Property', subjectId: propertyId, data: { rows: rows.length }, ip }, transaction);
    return rows;
  });
}

/**
 * Writes a soil test's lime and P and K into the unit's latest prescription (its lime and fertilizer
 * steps), computed again, with the source in the prescription's notes; still editable afterwards.
 */
export async function applySoilTest(actor: SessionUser, soilTestId: number, ip: string | null): Promise<{ soilTest: SoilTest; prescription: Prescription }> {
  return sequelize.transaction(async (transaction) => {
    const soilTest = await findInFirm(SoilTest, soilTestId, actor.firmId, 'That soil test', { transaction, lock: true });
    const unit = await findInFirm(Unit, soilTest.unitId, actor.firmId, 'That unit', { transaction });
    const { prescription, practice } = await unitContext(unit, transaction);
    if (!prescription || !practice) throw unprocessable('This unit has no prescription yet: write one, then apply the soil test to it.');
    const limeStep = practice.definition.steps.find((s) => s.application?.type === 'lime');
    const fertStep = practice.definition.steps.find((s) => s.application?.type === 'fertilizer' && (s.application.p2o5LbPerAcre > 0 || s.application.k2oLbPerAcre > 0));
    if (!limeStep && !fertStep) throw unprocessable(`“${practice.name}” has no lime or fertilizer step to set from a soil test.`);
    const rec = soilTest.recommendation;
    const steps = { ...(prescription.parameters.steps ?? {}) };
    if (limeStep) steps[limeStep.key] = { ...steps[limeStep.key], limeTonsPerAcre: Math.min(10, rec.lime.tonsPerAcre), limeEnmLbPerAcre: undefined };
    if (fertStep) steps[fertStep.key] = { ...steps[fertStep.key], p2o5LbPerAcre: rec.nutrients.p2o5LbPerAcre, k2oLbPerAcre: rec.nutrients.k2oLbPerAcre };
    const parameters: PrescriptionParameters = { ...prescription.parameters, steps: JSON.parse(JSON.stringify(steps)) as PrescriptionParameters['steps'] };
    const computed = await computePrescriptionRecord({ firmId: actor.firmId, unit, practice, year: prescription.year, targetDate: prescription.targetDate ?? undefined, count: prescription.count ?? undefined, parameters });
    const note = `Lime ${rec.lime.tonsPerAcre} t/acre and P2O5 ${rec.nutrients.p2o5LbPerAcre}, K2O ${rec.nutrients.k2oLbPerAcre} lb/acre from the soil test of ${formatDate(soilTest.sampledOn)} (${soilTest.lab}): lime by ${rec.lime.source}; P and K ${rec.nutrients.source}.`;
    await prescription.update(
      { parameters, result: computed.result, schedule: computed.schedule, cautions: computed.cautions, summary: computed.summary, totalCents: computed.totalCents, notes: [prescription.notes, note].filter(Boolean).join('\n') },
      { transaction },
    );
    soilTest.appliedPrescriptionId = prescription.id;
    await soilTest.save({ transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'soil-test.applied', subjectType: 'Prescription', subjectId: prescription.id, data: { soilTestId }, ip }, transaction);
    return { soilTest, prescription };
  });
}
