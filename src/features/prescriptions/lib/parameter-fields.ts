/**
 * The per-step values a prescription form asks for — seed rates per component, lime tons, N, P2O5
 * and K2O, sprayer volume and tank size, and whether to skip the step — prefilled from the practice
 * (or the prescription being changed), and the `parameters.steps` they become.
 */
import type { MaterialDefinition, PracticeDefinition, PrescriptionParameters, StepParameters } from '../../../../shared/domain/practice';
import { parseNumberInput } from '../../../lib/quantity-format';

export type ParameterKey = 'seedRate' | 'limeTonsPerAcre' | 'nLbPerAcre' | 'p2o5LbPerAcre' | 'k2oLbPerAcre' | 'gpa' | 'tankGal';

/** One number box of the form. */
export interface ParameterField {
  /** Unique in the form and equal to the server's path below `parameters.steps`, e.g. "lime.limeTonsPerAcre" or "seed.seedRatesLbPerAcre.seed-rape". */
  id: string;
  stepKey: string;
  key: ParameterKey;
  /** For seed rates: the seed material. */
  materialKey?: string;
  label: string;
  /** The practice's own value (the prefill when the prescription has none). */
  practiceValue: number | undefined;
  min: number;
  minExclusive: boolean;
  max: number;
}

/** A step of the form: its fields and whether it may be skipped. */
export interface ParameterStep {
  stepKey: string;
  name: string;
  fields: ParameterField[];
}

const nameOf = (materials: readonly MaterialDefinition[], key: string) => materials.find((m) => m.key === key)?.name ?? key;

/** The steps with values worth asking for, in practice order (steps without an application are left out). */
export function parameterSteps(practice: PracticeDefinition, materials: readonly MaterialDefinition[]): ParameterStep[] {
  const steps: ParameterStep[] = [];
  for (const step of practice.steps) {
    const a = step.application;
    if (!a) continue;
    const f = (key: ParameterKey, suffix: string, label: string, practiceValue: number | undefined, min: number, minExclusive: boolean, max: number, materialKey?: string): ParameterField => ({
      id: `${step.key}.${suffix}`,
      stepKey: step.key,
      key,
      materialKey,
      label,
      practiceValue,
      min,
      minExclusive,
      max,
    });
    let fields: ParameterField[] = [];
    if (a.type === 'seed') {
      fields = a.components.map((c) => f('seedRate', `seedRatesLbPerAcre.${c.materialKey}`, `${nameOf(materials, c.materialKey)}, lb${c.rateBasis === 'pls' ? ' PLS' : ''}/acre`, c.rateLbPerAcre, 0, true, 300, c.materialKey));
    } else if (a.type === 'lime') {
      fields = [f('limeTonsPerAcre', 'limeTonsPerAcre', 'Lime, tons/acre', a.tonsPerAcre, 0, false, 10)];
    } else if (a.type === 'fertilizer') {
      fields = [
        f('nLbPerAcre', 'nLbPerAcre', 'N, lb/acre', a.nLbPerAcre, 0, false, 400),
        f('p2o5LbPerAcre', 'p2o5LbPerAcre', 'P₂O₅, lb/acre', a.p2o5LbPerAcre, 0, false, 400),
        f('k2oLbPerAcre', 'k2oLbPerAcre', 'K₂O, lb/acre', a.k2oLbPerAcre, 0, false, 400),
      ];
    } else if (a.type === 'spray') {
      fields = [f('gpa', 'gpa', 'Sprayer, gal/acre', a.gpa, 0, true, 100), f('tankGal', 'tankGal', 'Tank, gal', a.tankGal, 0, true, 2000)];
    }
    steps.push({ stepKey: step.key, name: step.name, fields });
  }
  return steps;
}

/** The value a field starts with: the prescription's own, else the practice's. */
function startValue(field: ParameterField, own: StepParameters | undefined): number | undefined {
  if (field.key === 'seedRate') return own?.seedRatesLbPerAcre?.[field.materialKey as string] ?? field.practiceValue;
  return (own?.[field.key] as number | undefined) ?? field.practiceValue;
}

/** The form's starting texts and skipped steps. */
export function initialParameterTexts(steps: readonly ParameterStep[], parameters: PrescriptionParameters | undefined): { texts: Record<string, string>; skipped: string[] } {
  const texts: Record<string, string> = {};
  const skipped: string[] = [];
  for (const step of steps) {
    const own = parameters?.steps?.[step.stepKey];
    if (own?.skip) skipped.push(step.stepKey);
    for (const field of step.fields) {
      const value = startValue(field, own);
      texts[field.id] = value === undefined ? '' : String(value);
    }
  }
  return { texts, skipped };
}

/**
 * `parameters.steps` from the form: every filled value is written (the prescription keeps the rates
 * it was written with), skipped steps carry `skip: true`. A box may stay empty only where the
 * practice has no value either (lime from the soil test); the computation then asks for it.
 * Returns the problems per field id instead when a box holds no usable number.
 */
export function buildParameters(
  steps: readonly ParameterStep[],
  texts: Readonly<Record<string, string>>,
  skipped: readonly string[],
): { ok: true; parameters: PrescriptionParameters } | { ok: false; errors: Record<string, string> } {
  const errors: Record<string, string> = {};
  const out: Record<string, StepParameters> = {};
  for (const step of steps) {
    const params: StepParameters = {};
    if (skipped.includes(step.stepKey)) {
      // A skipped step's boxes are hidden, so they are neither checked nor kept.
      out[step.stepKey] = { skip: true };
      continue;
    }
    for (const field of step.fields) {
      const text = texts[field.id] ?? '';
      const value = parseNumberInput(text);
      if (value === undefined) {
        // An emptied box would silently fall back to the practice's value; ask for a number instead.
        if (field.practiceValue !== undefined) errors[field.id] = `Enter a number (the practice uses ${field.practiceValue}), or skip the step.`;
        continue;
      }
      if (Number.isNaN(value)) {
        errors[field.id] = `“${text.trim()}” is not a number.`;
        continue;
      }
      if (field.minExclusive ? value <= field.min : value < field.min) {
        errors[field.id] = field.minExclusive ? `Enter more than ${field.min}.` : `Enter ${field.min} or more.`;
        continue;
      }
      if (value > field.max) {
        errors[field.id] = `More than ${field.max} is not plausible here.`;
        continue;
      }
      if (field.key === 'seedRate') params.seedRatesLbPerAcre = { ...params.seedRatesLbPerAcre, [field.materialKey as string]: value };
      else params[field.key] = value;
    }
    if (Object.keys(params).length) out[step.stepKey] = params;
  }
  if (Object.keys(errors).length) return { ok: false, errors };
  return { ok: true, parameters: Object.keys(out).length ? { steps: out } : {} };
}

/** The form field a server or domain path points at ("parameters.steps.lime.limeTonsPerAcre" → "lime.limeTonsPerAcre"). */
export function fieldForPath(path: string, steps: readonly ParameterStep[]): string | null {
  const match = /^parameters\.steps\.(.+)$/.exec(path);
  if (!match) return null;
  const ids = steps.flatMap((s) => s.fields.map((f) => f.id));
  const rest = match[1];
  return ids.find((id) => rest === id || rest.startsWith(`${id}.`)) ?? null;
}
