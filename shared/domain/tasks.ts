/**
 * The work schedule's pure rules: turning an approved prescription's steps into tasks, the schedule
 * warnings (missed windows, steps before the step they depend on), the crew's week buckets, and
 * progress by count and by cost weight.
 */
import type { Caution } from './cautions';
import { CAUTIONS, STEP_KIND_CAUTIONS } from './cautions';
import type { PracticeDefinition } from './practice';
import type { PrescriptionResult } from './prescription-quantities';
import type { StepWindow } from './planting-windows';
import { addDays, parseIsoDate, type IsoDate } from './iso-dates';
import { formatDate, formatDateSpan } from './clock';

/** The header that carries a completion's idempotency key (one per completion, reused on every retry). */
export const IDEMPOTENCY_HEADER = 'Idempotency-Key';

export const TASK_STATUSES = ['planned', 'scheduled', 'done', 'skipped'] as const;
export type TaskStatus = (typeof TASK_STATUSES)[number];

/** What the crew applies in a task: one material (or one service) with its amount and the rate as written. */
export interface TaskQuantity {
  /** Material or service key; stable across a task's life, used to report what was actually used. */
  key: string;
  label: string;
  amount: number;
  unit: string;
  /** The rate the crew applies, e.g. "2.7 lb/acre broadcast". Empty for services. */
  rateText: string;
}

/** What the crew reports it actually used. */
export interface TaskQuantityUsed {
  key: string;
  label: string;
  amount: number;
  unit: string;
}

/** A task as the prescription makes it, before it is saved. */
export interface TaskDraft {
  stepKey: string;
  name: string;
  kind: string;
  dependsOn: string[];
  earliest: IsoDate;
  latest: IsoDate;
  /** The date the consultant put on the step, if any. */
  startDate: IsoDate | null;
  quantities: TaskQuantity[];
  cautions: Caution[];
  costCents: number;
  position: number;
}

export interface TaskSource {
  practice: Pick<PracticeDefinition, 'steps'>;
  result: Pick<PrescriptionResult, 'steps' | 'purchases' | 'lines'>;
  steps: readonly StepWindow[];
}

const round = (value: number, decimals: number): number => {
  const f = 10 ** decimals;
  return Math.round((value + Number.EPSILON) * f) / f;
};

/**
 * Splits whole cents among shares by largest remainder, so the parts always add up to the whole
 * (Hamilton's method; common practice for splitting money, no source).
 */
export function splitCents(totalCents: number, weights: readonly number[]): number[] {
  const sum = weights.reduce((a, b) => a + b, 0);
  if (weights.length === 0) return [];
  if (sum <= 0) return weights.map((_, i) => (i === 0 ? totalCents : 0));
  const exact = weights.map((w) => (totalCents * w) / sum);
  const parts = exact.map((x) => Math.floor(x));
  let left = totalCents - parts.reduce((a, b) => a + b, 0);
  const order = exact.map((x, i) => ({ i, frac: x - Math.floor(x) })).sort((a, b) => b.frac - a.frac || a.i - b.i);
  for (let k = 0; left > 0; k = (k + 1) % order.length, left -= 1) parts[order[k].i] += 1;
  return parts;
}

/** Each step's share of the prescription's cost: its own lines in full, pooled lines split evenly between their steps. */
export function stepCostCents(result: Pick<PrescriptionResult, 'lines'>, stepKeys: readonly string[]): Record<string, number> {
  const cost: Record<string, number> = Object.fromEntries(stepKeys.map((k) => [k, 0]));
  for (const line of result.lines) {
    const keys = line.stepKeys.filter((k) => k in cost);
    if (keys.length === 0) continue;
    const parts = splitCents(line.amountCents, keys.map(() => 1));
    keys.forEach((k, i) => (cost[k] += parts[i]));
  }
  return cost;
}

/** What one step applies: each material's amount for the step with the rate as written, then its services' hours. */
export function stepQuantities(result: Pick<PrescriptionResult, 'steps' | 'purchases'>, stepKey: string): TaskQuantity[] {
  const step = result.steps.find((s) => s.stepKey === stepKey);
  if (!step || step.skipped) return [];
  const out: TaskQuantity[] = [];
  for (const need of step.needs) {
    const purchase = result.purchases.find((p) => p.materialKey === need.materialKey);
    out.push({
      key: need.materialKey,
      label: purchase?.name ?? need.materialKey,
      amount: round(need.amount, 2),
      unit: purchase?.neededUnit ?? '',
      rateText: need.rateText,
    });
  }
  for (const service of step.serviceLines) {
    if (service.category !== 'labor' && service.category !== 'equipment') continue;
    out.push({ key: service.rateKey ?? `${service.category}:${service.description}`, label: service.description, amount: round(service.quantity, 2), unit: service.unit, rateText: '' });
  }
  return out;
}

/** Cautions for one step, from its kind, its own list and its spray application. */
export function stepCautions(practice: Pick<PracticeDefinition, 'steps'>, stepKey: string, prescriptionCautions: readonly Caution[]): Caution[] {
  const step = practice.steps.find((s) => s.key === stepKey);
  if (!step) return [];
  const ids = new Set<string>([...(STEP_KIND_CAUTIONS[step.kind] ?? []), ...(step.cautions ?? [])]);
  if (step.application?.type === 'spray') {
    ids.add('herbicide');
    // Restricted-use products are known at prescription level; a spray step carries that caution too.
    if (prescriptionCautions.some((c) => c.id === 'restricted-use')) ids.add('restricted-use');
  }
  return [...ids].map((id) => prescriptionCautions.find((c) => c.id === id) ?? CAUTIONS[id as keyof typeof CAUTIONS]).filter(Boolean);
}

/** The tasks an approved prescription makes: one per step that is not skipped, in step order. */
export function tasksFromPrescription(source: TaskSource, prescriptionCautions: readonly Caution[]): TaskDraft[] {
  const skipped = new Set(source.result.steps.filter((s) => s.skipped).map((s) => s.stepKey));
  const windows = source.steps.filter((s) => !skipped.has(s.stepKey) && !s.done);
  const costs = stepCostCents(source.result, windows.map((w) => w.stepKey));
  return windows.map((w, position) => {
    const step = source.practice.steps.find((s) => s.key === w.stepKey);
    return {
      stepKey: w.stepKey,
      name: w.name,
      kind: w.kind,
      dependsOn: (step?.dependsOn ?? []).filter((k) => !skipped.has(k)),
      earliest: w.earliest,
      latest: w.latest,
      startDate: w.scheduled,
      quantities: stepQuantities(source.result, w.stepKey),
      cautions: stepCautions(source.practice, w.stepKey, prescriptionCautions),
      costCents: costs[w.stepKey] ?? 0,
      position,
    };
  });
}

// ---- Schedule warnings ----

export interface ScheduledTask {
  id: number;
  prescriptionId: number | null;
  stepKey: string;
  name: string;
  unitName: string;
  status: TaskStatus;
  earliest: IsoDate;
  latest: IsoDate;
  startDate: IsoDate | null;
  endDate: IsoDate | null;
  doneOn?: IsoDate | null;
  dependsOn: readonly string[];
}

export type TaskWarningCode = 'window-missed' | 'window-closing' | 'outside-window' | 'before-dependency';

export interface TaskWarning {
  taskId: number;
  code: TaskWarningCode;
  message: string;
}

const open = (t: Pick<ScheduledTask, 'status'>) => t.status === 'planned' || t.status === 'scheduled';

/** Warnings across a schedule: windows missed or about to close, dates outside the window, and steps set before the step they depend on. */
export function taskWarnings(tasks: readonly ScheduledTask[], today: IsoDate, closingDays = 7): TaskWarning[] {
  parseIsoDate(today, 'today');
  const out: TaskWarning[] = [];
  const bySeries = new Map<string, ScheduledTask>();
  for (const t of tasks) bySeries.set(`${t.prescriptionId}:${t.stepKey}`, t);
  for (const t of tasks) {
    const label = `"${t.name}" on ${t.unitName}`;
    if (open(t)) {
      if (t.latest < today) {
        out.push({ taskId: t.id, code: 'window-missed', message: `${label}: its window closed on ${formatDate(t.latest)} and it is not done. Move it to next season or skip it with a reason.` });
      } else if (t.latest <= addDays(today, closingDays) && (!t.startDate || t.startDate > t.latest)) {
        out.push({ taskId: t.id, code: 'window-closing', message: `${label}: its window closes on ${formatDate(t.latest)}; schedule it before then.` });
      }
      const end = t.endDate ?? t.startDate;
      if (t.startDate && (t.startDate < t.earliest || (end && end > t.latest))) {
        out.push({ taskId: t.id, code: 'outside-window', message: `${label} is set for ${end && end !== t.startDate ? formatDateSpan(t.startDate, end) : formatDate(t.startDate)}, outside its window ${formatDateSpan(t.earliest, t.latest)}.` });
      }
    }
    if (!open(t) || !t.startDate) continue;
    for (const depKey of t.dependsOn) {
      const dep = bySeries.get(`${t.prescriptionId}:${depKey}`);
      if (!dep || dep.status === 'skipped') continue;
      const depFinish = dep.status === 'done' ? (dep.doneOn ?? null) : (dep.endDate ?? dep.startDate);
      if (dep.status !== 'done' && !depFinish) {
        out.push({ taskId: t.id, code: 'before-dependency', message: `${label} is scheduled but "${dep.name}", which must come first, has no date yet.` });
      } else if (depFinish && t.startDate < depFinish) {
        out.push({ taskId: t.id, code: 'before-dependency', message: `${label} starts ${formatDate(t.startDate)}, before "${dep.name}" (${formatDate(depFinish)}), which must come first.` });
      }
    }
  }
  return out;
}

// ---- The crew's week ----

export type FieldBucket = 'overdue' | 'this-week' | 'upcoming' | 'finished';

/** Monday of the week holding `date` (ISO 8601 weeks start on Monday). */
export function weekStart(date: IsoDate): IsoDate {
  const day = new Date(`${date}T00:00:00Z`).getUTCDay(); // 0 = Sunday
  return addDays(date, -((day + 6) % 7));
}

/** Where a task sits on the crew's sheet: overdue (its date or window passed), this week, later, or finished. */
export function fieldBucket(task: Pick<ScheduledTask, 'status' | 'startDate' | 'endDate' | 'latest' | 'earliest'>, today: IsoDate): FieldBucket {
  if (!open(task)) return 'finished';
  const due = task.endDate ?? task.startDate ?? task.latest;
  if (due < today || task.latest < today) return 'overdue';
  const start = task.startDate ?? task.earliest;
  const sunday = addDays(weekStart(today), 6);
  return start <= sunday ? 'this-week' : 'upcoming';
}

// ---- Progress ----

export interface ProgressInput {
  status: TaskStatus;
  costCents: number;
  unitId: number | null;
}

export interface Progress {
  total: number;
  done: number;
  skipped: number;
  open: number;
  /** Done as a share of the tasks that are not skipped, 0–100, one decimal. */
  percentByCount: number;
  doneCostCents: number;
  totalCostCents: number;
  /** Done cost as a share of the cost of tasks not skipped, 0–100, one decimal. */
  percentByCost: number;
}

export type UnitWorkStatus = 'no-work' | 'not-started' | 'in-progress' | 'done';

const pct = (part: number, whole: number) => (whole > 0 ? Math.round((part / whole) * 1000) / 10 : 0);

/** Progress of a set of tasks, by count and by cost weight; skipped tasks leave both the numerator and the denominator. */
export function progressOf(tasks: readonly ProgressInput[]): Progress {
  let done = 0;
  let skipped = 0;
  let doneCost = 0;
  let totalCost = 0;
  for (const t of tasks) {
    if (t.status === 'skipped') {
      skipped += 1;
      continue;
    }
    totalCost += t.costCents;
    if (t.status === 'done') {
      done += 1;
      doneCost += t.costCents;
    }
  }
  const counted = tasks.length - skipped;
  return {
    total: tasks.length,
    done,
    skipped,
    open: counted - done,
    percentByCount: pct(done, counted),
    doneCostCents: doneCost,
    totalCostCents: totalCost,
    percentByCost: totalCost > 0 ? pct(doneCost, totalCost) : pct(done, counted),
  };
}

/** A unit's work status from its tasks: nothing planned, not started, under way, or finished (every task done or skipped). */
export function unitWorkStatus(tasks: readonly Pick<ProgressInput, 'status'>[]): UnitWorkStatus {
  if (tasks.length === 0) return 'no-work';
  if (tasks.every((t) => t.status === 'done' || t.status === 'skipped')) return tasks.some((t) => t.status === 'done') ? 'done' : 'not-started';
  return tasks.some((t) => t.status === 'done' || t.status === 'skipped') ? 'in-progress' : 'not-started';
}

/** Progress for every unit that has tasks, keyed by unit id. */
export function progressByUnit(tasks: readonly ProgressInput[]): Map<number, Progress & { status: UnitWorkStatus }> {
  const groups = new Map<number, ProgressInput[]>();
  for (const t of tasks) {
    if (t.unitId === null) continue;
    const list = groups.get(t.unitId) ?? [];
    list.push(t);
    groups.set(t.unitId, list);
  }
  return new Map([...groups].map(([unitId, list]) => [unitId, { ...progressOf(list), status: unitWorkStatus(list) }]));
}

/** The status a task takes after an edit: scheduled once it has both a crew member and a start date, planned otherwise. */
export function plannedOrScheduled(assigneeId: number | null, startDate: IsoDate | null): 'planned' | 'scheduled' {
  return assigneeId !== null && startDate !== null ? 'scheduled' : 'planned';
}
