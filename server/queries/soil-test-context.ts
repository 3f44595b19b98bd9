/**
 * What a soil test of a unit is worked against: the firm's state method (its setting, else by region), the
 * crop group the unit's latest prescription sows and the ENM of its lime. The writer stores with it; the
 * browser previews with the same shared function (`recommendSoilTest`) from `GET /api/properties/:id/soil-test-context`.
 */
import type { Transaction } from 'sequelize';
import { Firm, Material, Practice, Prescription, Property, Unit } from '../models';
import { cropGroupOf, LIME_METHOD_LABELS, LIME_METHODS, METHOD_BUFFERS, TARGET_PH, type LimeMethod, type SoilTestContext } from '../../shared/domain/soil-tests';
import type { SoilTestContextDto } from '../../shared/schemas/soil-tests';

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

export interface UnitSoilContext {
  prescription: Prescription | null;
  practice: Practice | null;
  cropGroup: string;
  limeEnmLbPerTon: number;
}

/** The unit's latest prescription, the crop group it sows and the ENM of its lime (400 lb/ton when none is given). */
export async function unitSoilContext(unit: Unit, transaction?: Transaction): Promise<UnitSoilContext> {
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

/** The firm's settings and the state method for a property. */
export async function firmSoilSettings(firmId: number, propertyId: number, transaction?: Transaction): Promise<{ settings: Record<string, unknown>; method: LimeMethod }> {
  const firm = await Firm.findByPk(firmId, { attributes: ['settings', 'region'], transaction });
  const property = await Property.findByPk(propertyId, { attributes: ['region'], transaction });
  const settings = (firm?.settings ?? {}) as Record<string, unknown>;
  return { settings, method: limeMethodFor(settings, property?.region ?? firm?.region ?? null) };
}

/** A unit's context for `recommendSoilTest`. */
export async function soilTestContextOf(unit: Unit, transaction?: Transaction): Promise<SoilTestContext & { settings: Record<string, unknown> }> {
  const { settings, method } = await firmSoilSettings(unit.firmId, unit.propertyId, transaction);
  const context = await unitSoilContext(unit, transaction);
  return { method, cropGroup: context.cropGroup, limeEnmLbPerTon: context.limeEnmLbPerTon, settings };
}

/** The method and every unit's crop group, target pH and lime ENM on a property (the property must be in the firm already). */
export async function propertySoilTestContext(firmId: number, propertyId: number): Promise<SoilTestContextDto> {
  const { settings, method } = await firmSoilSettings(firmId, propertyId);
  const units = await Unit.findAll({ where: { firmId, propertyId }, order: [['name', 'ASC']] });
  const rows = await Promise.all(
    units.map(async (u) => {
      const c = await unitSoilContext(u);
      return { unitId: u.id, name: u.name, cropGroup: c.cropGroup, targetPh: (TARGET_PH[c.cropGroup] ?? TARGET_PH.grain!).ph, limeEnmLbPerTon: c.limeEnmLbPerTon };
    }),
  );
  return { method, methodLabel: LIME_METHOD_LABELS[method], buffers: METHOD_BUFFERS[method], retestYears: retestYearsFor(settings), units: rows };
}
