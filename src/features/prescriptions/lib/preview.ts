/**
 * The live preview of a prescription, computed in the browser with the same shared code the server
 * runs: quantities and cost, the step schedule, cautions and the landowner's summary.
 */
import { cautionsForPractice } from '../../../../shared/domain/cautions';
import { DomainValidationError } from '../../../../shared/domain/errors';
import { practiceWindow, REGIONS, schedulePrescription, type Region } from '../../../../shared/domain/planting-windows';
import type { MaterialDefinition, PracticeDefinition, PrescriptionParameters, UnitMeasures } from '../../../../shared/domain/practice';
import { computePrescription } from '../../../../shared/domain/prescription-quantities';
import { summarizePrescription } from '../../../../shared/domain/prescription-summary';
import type { ServiceRate } from '../../../../shared/domain/service-rates';
import type { PanelUnit, PrescriptionView } from './types';
import { firmToday } from '../../../lib/firm-clock';

/** Today's calendar date as YYYY-MM-DD in the firm's time zone, like the server. */
export const todayIso = (): string => firmToday();

/** A region name as the schedule takes it; unknown or missing regions fall back to the Midwest, as on the server. */
export function asRegion(value: string | null | undefined): Region {
  return value && (REGIONS as readonly string[]).includes(value) ? (value as Region) : 'midwest';
}

/** The unit's measures for the computations (count for point units). */
export function unitMeasures(unit: Pick<PanelUnit, 'acres' | 'lengthFt' | 'perimeterFt'>, count?: number): UnitMeasures {
  return {
    ...(unit.acres !== null ? { acres: unit.acres } : {}),
    ...(unit.lengthFt !== null ? { lengthFt: unit.lengthFt } : {}),
    ...(unit.perimeterFt !== null ? { perimeterFt: unit.perimeterFt } : {}),
    count: count ?? 1,
  };
}

/** The season year the server would pick without one: this year, or next year once this year's window has closed. */
export function defaultYear(practice: Pick<PracticeDefinition, 'windowKey'>, region: Region, today: string): number {
  const year = Number(today.slice(0, 4));
  return practiceWindow(practice, region, year).latest < today ? year + 1 : year;
}

export interface PreviewInput {
  unit: PanelUnit;
  practice: PracticeDefinition;
  materials: readonly MaterialDefinition[];
  rates: readonly ServiceRate[];
  parameters?: PrescriptionParameters;
  region: Region;
  year: number;
  targetDate?: string;
  count?: number;
  today: string;
}

export type PreviewResult = { ok: true; view: PrescriptionView } | { ok: false; field: string; message: string };

/** Computes a prescription like the server does; a DomainValidationError comes back as a message naming its field. */
export function previewPrescription(input: PreviewInput): PreviewResult {
  try {
    const measures = unitMeasures(input.unit, input.count);
    const result = computePrescription({ unit: measures, practice: input.practice, materials: input.materials, rates: input.rates, parameters: input.parameters });
    const schedule = schedulePrescription({ practice: input.practice, region: input.region, year: input.year, targetDate: input.targetDate, today: input.today });
    const cautions = cautionsForPractice(input.practice, input.materials).map((c) => ({ id: c.id, title: c.title, text: c.text }));
    const summary = summarizePrescription({ practice: input.practice, unit: measures, materials: input.materials, schedule, totalCents: result.totalCents });
    const { practiceKey: _key, count: _count, ...quantities } = result;
    return { ok: true, view: { ...quantities, schedule, warnings: schedule.warnings, cautions, summary } };
  } catch (error) {
    if (error instanceof DomainValidationError) return { ok: false, field: error.field, message: error.message };
    return { ok: false, field: '', message: error instanceof Error ? error.message : 'The preview could not be computed.' };
  }
}
