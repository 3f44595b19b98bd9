/** Plain-language summary of a prescription for the landowner: what, why, when, and what it costs. */
import { formatMonthDay, type DateWindow, type ScheduleResult } from './planting-windows';
import { practiceSeedMaterials, type MaterialDefinition, type PracticeDefinition, type UnitMeasures } from './practice';
import { roundHalfUp } from './rounding';

export interface SummaryInput {
  practice: PracticeDefinition;
  unit: UnitMeasures;
  materials?: readonly MaterialDefinition[];
  /** The prescription's own window for the main work; otherwise the schedule's anchor window. */
  window?: DateWindow;
  schedule?: ScheduleResult;
  totalCents?: number;
}

/** Join words as "a, b and c". */
export function joinWithAnd(words: readonly string[]): string {
  if (words.length <= 1) return words.join('');
  return `${words.slice(0, -1).join(', ')} and ${words[words.length - 1]}`;
}

/** "$1,234.56" from integer cents. */
export function formatDollars(cents: number): string {
  const sign = cents < 0 ? '-' : '';
  const abs = Math.abs(Math.round(cents));
  const dollars = Math.floor(abs / 100).toLocaleString('en-US');
  return `${sign}$${dollars}.${String(abs % 100).padStart(2, '0')}`;
}

/** "Aug 15", with the year when it differs from the reference date's year ("Aug 15, 2025"). */
function dateText(date: string, reference: string): string {
  return date.slice(0, 4) === reference.slice(0, 4) ? formatMonthDay(date) : `${formatMonthDay(date)}, ${date.slice(0, 4)}`;
}

function sizeText(practice: PracticeDefinition, unit: UnitMeasures): string {
  if (practice.measure === 'acres') {
    const acres = unit.acres ?? 0;
    const shown = roundHalfUp(acres, acres < 1 ? 2 : 1);
    return `${shown.toLocaleString('en-US')} ${shown === 1 ? 'acre' : 'acres'}`;
  }
  if (practice.measure === 'feet') {
    const feet = roundHalfUp(unit.lengthFt ?? unit.perimeterFt ?? 0, 0);
    return `${feet.toLocaleString('en-US')} ft`;
  }
  return String(unit.count ?? 1);
}

function whatSentence(input: SummaryInput): string {
  const { practice, unit } = input;
  const { action, subject, subjectPlural, purpose } = practice.summary;
  const species = practiceSeedMaterials(practice, input.materials ?? []).map((m) => m.species);
  const named = species.every((name) => subject.toLowerCase().includes(name.toLowerCase()));
  const speciesText = species.length > 0 && !named ? ` (${joinWithAnd(species)})` : '';
  let what: string;
  if (practice.measure === 'each' && (unit.count ?? 1) === 1) {
    what = `${action} ${subject}${speciesText}`;
  } else if (practice.measure === 'each') {
    what = `${action} ${sizeText(practice, unit)} ${subjectPlural ?? subject}${speciesText}`;
  } else {
    what = `${action} ${sizeText(practice, unit)} of ${subject}${speciesText}`;
  }
  const window = input.window ?? input.schedule?.anchorWindow;
  const when = window ? ` between ${formatMonthDay(window.earliest)} and ${dateText(window.latest, window.earliest)}` : '';
  return `${what}${when} to ${purpose}.`;
}

/** A couple of sentences for the landowner: what is done, why, when, how preparation starts and the estimated cost. */
export function summarizePrescription(input: SummaryInput): string {
  const sentences = [whatSentence(input)];
  const schedule = input.schedule;
  if (schedule) {
    const anchor = schedule.steps.find((s) => s.isAnchor);
    const first = [...schedule.steps].filter((s) => !s.isAnchor).sort((a, b) => (a.earliest < b.earliest ? -1 : a.earliest > b.earliest ? 1 : 0))[0];
    if (anchor && first && first.earliest < schedule.targetDate) {
      sentences.push(`Preparation starts on or after ${dateText(first.earliest, schedule.targetDate)}: ${first.name.toLowerCase()}.`);
    }
    if (schedule.grazeable) {
      sentences.push(`Deer can graze it from about ${dateText(schedule.grazeable.earliest, schedule.targetDate)}.`);
    }
  }
  if (input.totalCents !== undefined) {
    sentences.push(`The estimated cost is ${formatDollars(input.totalCents)}.`);
  }
  return sentences.join(' ');
}
