/** The numeric values of a practice's steps a consultant may change on the practice page, and applying them to a copy of the steps. */
import type { MaterialDefinition, PracticeStep } from '../../../../shared/domain/practice';
import { sprayRateText } from './practice-text';
import { parseNumberInput } from '../../../lib/quantity-format';

type PathPart = string | number;

/** One editable number of a step: where it lives in the step, its label, and the range a person may enter. */
export interface EditableNumber {
  /** Unique across the practice, e.g. "2:application.gpa". */
  id: string;
  stepIndex: number;
  path: PathPart[];
  label: string;
  value: number | undefined;
  min: number;
  /** True when the value must be more than `min`, not equal to it. */
  minExclusive: boolean;
  max: number;
  /** An empty box removes the value (the computation then asks for it or uses none). */
  optional: boolean;
}

const nameOf = (materials: readonly MaterialDefinition[], key: string) => materials.find((m) => m.key === key)?.name ?? key;

/** The editable numbers of one step: seed rates, lime tons, fertilizer N-P-K, spray product rates, spray volume and tank size. */
export function editableNumbers(step: PracticeStep, stepIndex: number, materials: readonly MaterialDefinition[]): EditableNumber[] {
  const a = step.application;
  if (!a) return [];
  const field = (path: PathPart[], label: string, value: number | undefined, min: number, minExclusive: boolean, max: number, optional = false): EditableNumber => ({
    id: `${stepIndex}:${path.join('.')}`,
    stepIndex,
    path,
    label,
    value,
    min,
    minExclusive,
    max,
    optional,
  });
  switch (a.type) {
    case 'seed':
      return a.components.map((c, i) => field(['application', 'components', i, 'rateLbPerAcre'], `${nameOf(materials, c.materialKey)}, lb${c.rateBasis === 'pls' ? ' PLS' : ''}/acre`, c.rateLbPerAcre, 0, true, 300));
    case 'lime':
      return [field(['application', 'tonsPerAcre'], `${nameOf(materials, a.materialKey)}, t/acre`, a.tonsPerAcre, 0, false, 10, true)];
    case 'fertilizer':
      return [
        field(['application', 'nLbPerAcre'], 'N, lb/acre', a.nLbPerAcre, 0, false, 400),
        field(['application', 'p2o5LbPerAcre'], 'P₂O₅, lb/acre', a.p2o5LbPerAcre, 0, false, 400),
        field(['application', 'k2oLbPerAcre'], 'K₂O, lb/acre', a.k2oLbPerAcre, 0, false, 400),
      ];
    case 'spray':
      return [
        ...a.products.map((p, i) => {
          const name = nameOf(materials, p.materialKey);
          const unit = sprayRateText(p.rate).replace(/^[\d.,]+\s*/, '');
          if (p.rate.kind === 'product') return field(['application', 'products', i, 'rate', 'amountPerAcre'], `${name}, ${unit}`, p.rate.amountPerAcre, 0, true, 2560);
          if (p.rate.kind === 'active') return field(['application', 'products', i, 'rate', 'lbAiPerAcre'], `${name}, ${unit}`, p.rate.lbAiPerAcre, 0, true, 20);
          return field(['application', 'products', i, 'rate', 'pctOfSpray'], `${name}, ${unit}`, p.rate.pctOfSpray, 0, true, 100);
        }),
        field(['application', 'gpa'], 'Spray volume, gal/acre', a.gpa, 0, true, 100, true),
        field(['application', 'tankGal'], 'Tank, gal', a.tankGal, 0, true, 2000, true),
      ];
    case 'items':
      return [];
  }
}

/** Checks one typed value against its range; the message says what to enter. */
export function checkNumber(text: string, f: Pick<EditableNumber, 'min' | 'minExclusive' | 'max' | 'optional'>): { value: number | undefined; error?: string } {
  const value = parseNumberInput(text);
  if (value === undefined) return f.optional ? { value } : { value, error: 'Enter a number.' };
  if (Number.isNaN(value)) return { value, error: `“${text.trim()}” is not a number.` };
  if (f.minExclusive ? value <= f.min : value < f.min) return { value, error: f.minExclusive ? `Enter more than ${f.min}.` : `Enter ${f.min} or more.` };
  if (value > f.max) return { value, error: `More than ${f.max} is not plausible here.` };
  return { value };
}

function setPath(target: unknown, path: PathPart[], value: number | undefined): void {
  let node = target as Record<PathPart, unknown>;
  for (const part of path.slice(0, -1)) node = node[part] as Record<PathPart, unknown>;
  const last = path[path.length - 1];
  if (value === undefined) delete node[last];
  else node[last] = value;
}

/** A copy of the steps with the typed values written in, or the problems per field id. */
export function applyEdits(
  steps: readonly PracticeStep[],
  fields: readonly EditableNumber[],
  texts: Readonly<Record<string, string>>,
): { ok: true; steps: PracticeStep[] } | { ok: false; errors: Record<string, string> } {
  const copy = structuredClone(steps) as PracticeStep[];
  const errors: Record<string, string> = {};
  for (const f of fields) {
    const text = texts[f.id] ?? (f.value === undefined ? '' : String(f.value));
    const checked = checkNumber(text, f);
    if (checked.error) errors[f.id] = checked.error;
    else setPath(copy[f.stepIndex], f.path, checked.value);
  }
  return Object.keys(errors).length ? { ok: false, errors } : { ok: true, steps: copy };
}
