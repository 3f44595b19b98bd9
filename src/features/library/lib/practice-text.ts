/** Words for a practice's steps: timing relative to the anchor step, what a step applies, the services it uses. */
import { formatGrade } from '../../../../shared/domain/fertilizer';
import { PLANTING_WINDOWS } from '../../../../shared/domain/planting-windows';
import type { MaterialDefinition, PracticeDefinition, PracticeStep, StepApplication, StepService } from '../../../../shared/domain/practice';
import type { Productivity, ServiceRate } from '../../../../shared/domain/service-rates';
import type { SprayRate } from '../../../../shared/domain/spraying';
import { formatQuantity } from '../../../lib/quantity-format';

const ANCHOR_NOUNS: Partial<Record<PracticeStep['kind'], string>> = {
  seed: 'seeding',
  plant: 'planting',
  burn: 'the burn',
  spray: 'spraying',
  'hinge-cut': 'hinge-cutting',
  chainsaw: 'the cutting',
  build: 'building',
  clear: 'clearing',
  scent: 'setting the scrape',
};

/** What the anchor step is called in timing phrases: "seeding", "planting", or "the <step name>". */
export function anchorNoun(practice: Pick<PracticeDefinition, 'steps' | 'anchorStepKey'>): string {
  const anchor = practice.steps.find((s) => s.key === practice.anchorStepKey);
  if (!anchor) return 'the main step';
  return ANCHOR_NOUNS[anchor.kind] ?? `the ${anchor.name.charAt(0).toLowerCase()}${anchor.name.slice(1)}`;
}

const days = (n: number) => (n === 1 ? '1 day' : `${n} days`);
function span(a: number, b: number): string {
  if (a === b) return days(a);
  const text = `${a}–${b} days`;
  // Long lead times read better with months beside the days.
  if (b >= 60) {
    const [ma, mb] = [Math.max(1, Math.round(a / 30.44)), Math.round(b / 30.44)];
    return `${text} (about ${ma === mb ? ma : `${ma}–${mb}`} months)`;
  }
  return text;
}

/**
 * A step's timing in words from its offsets to the anchor step: "7–14 days before seeding",
 * "30–45 days after seeding", "on the day of seeding or up to 3 days before".
 */
export function timingWords(offsetEarliestDays: number, offsetLatestDays: number, anchor: string): string {
  const [e, l] = [offsetEarliestDays, offsetLatestDays];
  if (e === 0 && l === 0) return `on the day of ${anchor}`;
  if (l < 0) return `${span(-l, -e)} before ${anchor}`;
  if (e > 0) return `${span(e, l)} after ${anchor}`;
  if (l === 0) return `on the day of ${anchor} or up to ${days(-e)} before`;
  if (e === 0) return `on the day of ${anchor} or up to ${days(l)} after`;
  return `from ${days(-e)} before to ${days(l)} after ${anchor}`;
}

/** The timing of a step in words, or for the anchor step the season window it falls in. */
export function stepTimingText(step: PracticeStep, practice: Pick<PracticeDefinition, 'steps' | 'anchorStepKey' | 'windowKey'>): string {
  if (step.key === practice.anchorStepKey) return `In the ${PLANTING_WINDOWS[practice.windowKey].label.toLowerCase()} window`;
  if (!step.timing) return 'No lead time set';
  return `${timingWords(step.timing.offsetEarliestDays, step.timing.offsetLatestDays, anchorNoun(practice))}`.replace(/^./, (c) => c.toUpperCase());
}

const LIQUID_UNITS: Record<string, string> = { gal: 'gal', qt: 'qt', pt: 'pt', 'fl-oz': 'fl oz' };

/** A spray rate as written on a label: "2 qt/acre", "1.5 lb a.i./acre", "0.25 % of the spray". */
export function sprayRateText(rate: SprayRate): string {
  if (rate.kind === 'product') return `${formatQuantity(rate.amountPerAcre, 3)} ${LIQUID_UNITS[rate.unit] ?? rate.unit}/acre`;
  if (rate.kind === 'active') return `${formatQuantity(rate.lbAiPerAcre, 3)} lb a.i./acre`;
  return `${formatQuantity(rate.pctOfSpray, 3)} % of the spray`;
}

const nameOf = (materials: readonly MaterialDefinition[], key: string) => materials.find((m) => m.key === key)?.name ?? `${key} (not in the library)`;

const ITEM_BASIS: Record<string, string> = { 'per-acre': 'per acre', 'per-100-ft': 'per 100 ft', 'per-each': 'each', fixed: 'in all' };

/** One line per thing a step applies, with its rate: seed components, lime, fertilizer grade and N-P-K, spray products, items. */
export function applicationLines(application: StepApplication | undefined, materials: readonly MaterialDefinition[]): string[] {
  if (!application) return [];
  switch (application.type) {
    case 'seed':
      return application.components.map((c) => {
        const share = c.mixSharePct !== undefined && c.mixSharePct < 100 ? `, ${formatQuantity(c.mixSharePct)} % of the mix` : '';
        return `${nameOf(materials, c.materialKey)}: ${formatQuantity(c.rateLbPerAcre)} lb${c.rateBasis === 'pls' ? ' PLS' : ''}/acre ${application.method}${share}`;
      });
    case 'lime': {
      const rate = application.tonsPerAcre !== undefined ? `${formatQuantity(application.tonsPerAcre)} t/acre` : application.enmLbPerAcre !== undefined ? `${formatQuantity(application.enmLbPerAcre, 0)} lb ENM/acre` : 'rate from the soil test';
      return [`${nameOf(materials, application.materialKey)}: ${rate}`];
    }
    case 'fertilizer': {
      const m = materials.find((x) => x.key === application.materialKey);
      const gradeText = m?.type === 'fertilizer' ? formatGrade(m.grade) : '';
      const grade = gradeText && !m?.name.includes(gradeText) ? ` (${gradeText})` : '';
      return [`${nameOf(materials, application.materialKey)}${grade}: N ${formatQuantity(application.nLbPerAcre)} · P₂O₅ ${formatQuantity(application.p2o5LbPerAcre)} · K₂O ${formatQuantity(application.k2oLbPerAcre)} lb/acre`];
    }
    case 'spray': {
      const sprayer = [
        application.gpa !== undefined ? `${formatQuantity(application.gpa)} gal/acre spray volume` : 'applied undiluted',
        application.tankGal !== undefined ? `${formatQuantity(application.tankGal)}-gal tank` : null,
        application.treatedFraction !== undefined && application.treatedFraction < 1 ? `${formatQuantity(application.treatedFraction * 100, 0)} % of the unit treated` : null,
      ].filter(Boolean);
      return [...application.products.map((p) => `${nameOf(materials, p.materialKey)}: ${sprayRateText(p.rate)}`), sprayer.join(', ')];
    }
    case 'items':
      return application.items.map((i) => `${nameOf(materials, i.materialKey)}: ${formatQuantity(i.quantity)} ${ITEM_BASIS[i.basis] ?? i.basis}`);
  }
}

/** How long the work takes, in words: "0.5 h/acre", "0.05 h/100 ft", "2 h each", "3 h in all". */
export function productivityText(p: Productivity | undefined): string | null {
  if (!p) return null;
  if (p.hoursPerAcre !== undefined) return `${formatQuantity(p.hoursPerAcre, 3)} h/acre`;
  if (p.hoursPer100Ft !== undefined) return `${formatQuantity(p.hoursPer100Ft, 3)} h/100 ft`;
  if (p.hoursPerEach !== undefined) return `${formatQuantity(p.hoursPerEach, 3)} h each`;
  if (p.fixedHours !== undefined) return `${formatQuantity(p.fixedHours, 3)} h in all`;
  return null;
}

/** A step's service in words: the rate's name, its productivity or fixed quantity. */
export function serviceText(service: StepService, rates: readonly ServiceRate[]): string {
  const rate = rates.find((r) => r.key === service.rateKey);
  const parts = [productivityText(service.productivity), service.quantity !== undefined ? `× ${formatQuantity(service.quantity)}` : null].filter(Boolean);
  return `${rate?.name ?? `${service.rateKey} (not in the library)`}${parts.length ? ` — ${parts.join(', ')}` : ''}`;
}
