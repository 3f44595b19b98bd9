/**
 * Writes soil tests of a unit with the lime and fertilizer recommendation worked by the firm's state
 * method (shared/domain/soil-tests), imports a lab's CSV by unit name (all rows or none), and writes
 * a test's recommendation into the unit's prescription. Each write is one transaction with its audit.
 */
import type { CreationAttributes, Transaction } from 'sequelize';
import { parse } from 'csv-parse/sync';
import { ZodError } from 'zod';
import { sequelize } from '../db/sequelize';
import { Prescription, Property, Unit } from '../models';
import { SoilTest } from '../models/soil-test';
import { findInFirm } from '../policies/firm-scope';
import { unprocessable } from '../errors';
import { recordAudit } from './audit-recorder';
import { computePrescriptionRecord } from './prescription-writer';
import { DomainValidationError } from '../../shared/domain/errors';
import { recommendSoilTest, retestDue, type BufferMethod } from '../../shared/domain/soil-tests';
import { guessSoilCsvColumns, soilCsvRowBody, SOIL_CSV_FIELD_LABELS, unitNameKey, unmappedRequired, type SoilCsvColumns } from '../../shared/domain/soil-csv';
import { retestYearsFor, soilTestContextOf, unitSoilContext } from '../queries/soil-test-context';
import { SOIL_CSV_MAX_ROWS, SoilTestCreateSchema, type SoilCsvRowProblem, type SoilTestCreateValues } from '../../shared/schemas/soil-tests';
import type { PrescriptionParameters } from '../../shared/domain/practice';
import type { SessionUser } from '../../shared/schemas/auth';
import { formatDate } from '../../shared/domain/clock';

export { DEFAULT_RETEST_YEARS, limeMethodFor, retestYearsFor } from '../queries/soil-test-context';

type SoilTestAttributes = CreationAttributes<SoilTest>;

/** The row to store for one soil test: its recommendation worked by the shared function (throws DomainValidationError naming a field). */
async function prepareOne(actor: SessionUser, unit: Unit, values: SoilTestCreateValues, transaction: Transaction): Promise<SoilTestAttributes> {
  const context = await soilTestContextOf(unit, transaction);
  const test = { ...values, bufferMethod: (values.bufferMethod ?? null) as BufferMethod | null, labMethod: values.labMethod ?? null };
  const recommendation = recommendSoilTest(test, context);
  return {
    firmId: actor.firmId,
    propertyId: unit.propertyId,
    unitId: unit.id,
    sampledOn: values.sampledOn,
    lab: values.lab,
    ph: values.ph,
    bufferPh: values.bufferPh ?? null,
    bufferMethod: values.bufferMethod ?? null,
    labMethod: values.labMethod ?? 'bray-nh4oac',
    pPpm: values.pPpm ?? null,
    kPpm: values.kPpm ?? null,
    organicMatterPct: values.organicMatterPct ?? null,
    cec: values.cec ?? null,
    enmLbPerAcre: values.enmLbPerAcre ?? null,
    cropGroup: context.cropGroup,
    recommendation,
    retestDue: retestDue(values.sampledOn, retestYearsFor(context.settings)),
    appliedPrescriptionId: null,
    createdById: actor.id,
  };
}

async function writeOne(actor: SessionUser, unit: Unit, values: SoilTestCreateValues, transaction: Transaction): Promise<SoilTest> {
  return SoilTest.create(await prepareOne(actor, unit, values, transaction), { transaction });
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

/** Most refused rows the answer's sentence lists (all are in `details`). */
const LISTED_PROBLEMS = 5;

/**
 * Imports a lab's CSV (header row; a column naming plan units of the property, matched by `columns` or by
 * header names): every row is checked first and every problem reported by row and field; then all rows
 * are stored in one transaction, or none.
 */
export async function importSoilTests(actor: SessionUser, propertyId: number, csv: string, ip: string | null, columns?: SoilCsvColumns): Promise<SoilTest[]> {
  let records: Record<string, string>[];
  let headers: string[] = [];
  try {
    records = parse(csv, { columns: (header: string[]) => (headers = header.map((h) => h.trim())), skip_empty_lines: true, trim: true, bom: true }) as Record<string, string>[];
  } catch (error) {
    throw unprocessable(`csv: the file could not be read as CSV (${(error as Error).message}). Save it from the spreadsheet as "CSV UTF-8" with a header row.`);
  }
  if (records.length === 0) throw unprocessable('csv: no rows under the header. Put one soil test per row with a "unit" column.');
  if (records.length > SOIL_CSV_MAX_ROWS) throw unprocessable(`csv: at most ${SOIL_CSV_MAX_ROWS} rows at a time (got ${records.length}).`);
  const mapping = columns ?? guessSoilCsvColumns(headers);
  const strayColumn = Object.entries(mapping).find(([, header]) => !headers.includes(header));
  if (strayColumn) throw unprocessable(`columns.${strayColumn[0]}: the file has no column “${strayColumn[1]}”. Pick one of ${headers.join(', ')}.`);
  const missing = unmappedRequired(mapping);
  if (missing.length) throw unprocessable(`columns: say which column holds ${missing.map((f) => SOIL_CSV_FIELD_LABELS[f].toLowerCase()).join(', ')}.`, missing.map((f) => ({ path: `columns.${f}`, message: 'pick the column' })));
  return sequelize.transaction(async (transaction) => {
    await findInFirm(Property, propertyId, actor.firmId, 'That property', { transaction });
    const units = await Unit.findAll({ where: { propertyId, firmId: actor.firmId }, transaction });
    const byName = new Map(units.map((u) => [unitNameKey(u.name), u]));
    const problems: SoilCsvRowProblem[] = [];
    const prepared: SoilTestAttributes[] = [];
    for (const [i, record] of records.entries()) {
      const row = i + 2;
      const { unitName, body } = soilCsvRowBody(record, mapping);
      const unit = byName.get(unitNameKey(unitName));
      if (!unit) {
        problems.push({ row, field: 'unit', message: `“${unitName}” is not a unit of this property. Use the unit names on the plan map` });
        continue;
      }
      const parsed = SoilTestCreateSchema.safeParse(body);
      if (!parsed.success) {
        for (const issue of parsed.error.issues) problems.push({ row, field: issue.path.join('.') || 'row', message: issue.message });
        continue;
      }
      try {
        prepared.push(await prepareOne(actor, unit, parsed.data, transaction));
      } catch (error) {
        if (error instanceof DomainValidationError) problems.push({ row, field: error.field, message: error.message });
        else if (error instanceof ZodError) problems.push({ row, field: 'row', message: error.issues[0]?.message ?? 'not valid' });
        else throw error;
      }
    }
    if (problems.length) {
      const rowsWrong = new Set(problems.map((p) => p.row)).size;
      const listed = problems.slice(0, LISTED_PROBLEMS).map((p) => `csv row ${p.row}, ${p.field}: ${p.message.replace(/\.$/, '')}`).join('; ');
      const more = problems.length > LISTED_PROBLEMS ? `; and ${problems.length - LISTED_PROBLEMS} more` : '';
      throw unprocessable(`Nothing was saved: ${rowsWrong} of ${records.length} ${records.length === 1 ? 'row needs' : 'rows need'} changes. ${listed}${more}.`, problems.map((p) => ({ path: `rows.${p.row}.${p.field}`, message: p.message, row: p.row, field: p.field })));
    }
    const rows: SoilTest[] = [];
    for (const attributes of prepared) rows.push(await SoilTest.create(attributes, { transaction }));
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
    const { prescription, practice } = await unitSoilContext(unit, transaction);
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
