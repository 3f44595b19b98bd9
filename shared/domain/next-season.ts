/**
 * Rolling a plan into the next season: each unit's prescription carried over and adjusted from the
 * evidence — plots that failed or came up thin sown again, mixes shifted toward the species browse
 * checks show deer prefer, lime and P and K from the latest soil test, and a warning when a plot
 * would carry the same crop family two seasons running. Every change carries its reason and is
 * accepted or rejected by the consultant before anything is written.
 */
import type { StepParameters } from './practice';
import { formatDate } from './clock';

export const SEASON_CHANGE_KINDS = ['reseed', 'shift-mix', 'lime', 'rotation'] as const;
export type SeasonChangeKind = (typeof SEASON_CHANGE_KINDS)[number];
export type ChangeDecision = 'proposed' | 'accepted' | 'rejected';

/** Rate multiplier for a species deer prefer (Jacobs' D > 0) and for one they avoid (D < 0) (common practice, no source). */
export const PREFERRED_RATE_FACTOR = 1.25;
export const AVOIDED_RATE_FACTOR = 0.75;
/** A soil test older than this many years does not set next season's lime (the default retest interval). */
export const SOIL_TEST_MAX_AGE_YEARS = 3;

export interface SeedComponentEvidence {
  materialKey: string;
  species: string;
  rateLbPerAcre: number;
}

export interface UnitEvidence {
  unitId: number;
  unitName: string;
  prescription: {
    practiceId: number;
    practiceName: string;
    /** The crop family the practice sows (legume, brassica, grain, native-grass), null for no seeding. */
    family: string | null;
    seedStepKey: string | null;
    components: SeedComponentEvidence[];
    limeStepKey: string | null;
    fertilizerStepKey: string | null;
    parameters: { steps?: Record<string, StepParameters> };
  } | null;
  /** The crop family the unit carried the season before the prescription's. */
  previousFamily: string | null;
  establishment: { status: 'established' | 'thin' | 'failed'; checkedOn: string; reason: string } | null;
  /** Jacobs' D per species from the latest browse check. */
  preference: { species: string; jacobsD: number | null }[] | null;
  soilTest: { sampledOn: string; limeTonsPerAcre: number; p2o5LbPerAcre: number; k2oLbPerAcre: number; source: string } | null;
}

export interface SeasonChange {
  id: string;
  unitId: number;
  unitName: string;
  kind: SeasonChangeKind;
  reason: string;
  /** Step parameters this change sets when accepted (none for a warning). */
  steps: Record<string, StepParameters>;
  decision: ChangeDecision;
}

export interface SeasonUnitPlan {
  unitId: number;
  unitName: string;
  practiceId: number;
  practiceName: string;
  /** The carried-over parameters, before any change. */
  parameters: { steps?: Record<string, StepParameters> };
}

export interface SeasonPlan {
  season: number;
  units: SeasonUnitPlan[];
  changes: SeasonChange[];
}

const round2 = (n: number) => Math.round(n * 100) / 100;

/** Drafts next season's plan from each unit's evidence; `season` is the year drafted. */
export function planNextSeason(season: number, units: readonly UnitEvidence[]): SeasonPlan {
  const plan: SeasonPlan = { season, units: [], changes: [] };
  for (const unit of units) {
    const p = unit.prescription;
    if (!p) continue;
    const carried = JSON.parse(JSON.stringify(p.parameters ?? {})) as SeasonUnitPlan['parameters'];
    // A re-seeding scaled this season's rates down; next season starts from the practice's full rates.
    if (p.seedStepKey && carried.steps?.[p.seedStepKey]) delete carried.steps[p.seedStepKey]!.seedRatesLbPerAcre;
    plan.units.push({ unitId: unit.unitId, unitName: unit.unitName, practiceId: p.practiceId, practiceName: p.practiceName, parameters: carried });
    const add = (kind: SeasonChangeKind, reason: string, steps: Record<string, StepParameters> = {}) =>
      plan.changes.push({ id: `${unit.unitId}-${kind}`, unitId: unit.unitId, unitName: unit.unitName, kind, reason, steps, decision: 'proposed' });

    if (unit.establishment && unit.establishment.status !== 'established' && p.seedStepKey) {
      add('reseed', `${unit.establishment.status === 'failed' ? 'Failed' : 'Thin'} stand at the check of ${formatDate(unit.establishment.checkedOn)}: ${unit.establishment.reason} Sow ${p.practiceName.toLowerCase()} again at the full rate.`, {
        [p.seedStepKey]: { seedRatesLbPerAcre: Object.fromEntries(p.components.map((c) => [c.materialKey, c.rateLbPerAcre])) },
      });
    }

    if (unit.preference && p.seedStepKey && p.components.length > 1) {
      const d = new Map(unit.preference.map((x) => [x.species.toLowerCase(), x.jacobsD]));
      const rates: Record<string, number> = {};
      const up: string[] = [];
      const down: string[] = [];
      for (const c of p.components) {
        const jd = d.get(c.species.toLowerCase());
        const factor = jd === undefined || jd === null ? 1 : jd > 0 ? PREFERRED_RATE_FACTOR : jd < 0 ? AVOIDED_RATE_FACTOR : 1;
        if (factor > 1) up.push(`${c.species} (D ${jd!.toFixed(2)})`);
        if (factor < 1) down.push(`${c.species} (D ${jd!.toFixed(2)})`);
        rates[c.materialKey] = round2(c.rateLbPerAcre * factor);
      }
      if (up.length > 0 || down.length > 0) {
        add('shift-mix', `Browse checks show deer prefer ${up.join(', ') || 'none of the mix'}${down.length ? ` and pass over ${down.join(', ')}` : ''} (Jacobs 1974 index): more seed of the preferred, less of the avoided.`, { [p.seedStepKey]: { seedRatesLbPerAcre: rates } });
      }
    }

    if (unit.soilTest && (p.limeStepKey || p.fertilizerStepKey) && Number(unit.soilTest.sampledOn.slice(0, 4)) >= season - SOIL_TEST_MAX_AGE_YEARS) {
      const steps: Record<string, StepParameters> = {};
      if (p.limeStepKey) steps[p.limeStepKey] = { limeTonsPerAcre: unit.soilTest.limeTonsPerAcre };
      if (p.fertilizerStepKey) steps[p.fertilizerStepKey] = { p2o5LbPerAcre: unit.soilTest.p2o5LbPerAcre, k2oLbPerAcre: unit.soilTest.k2oLbPerAcre };
      add('lime', `Soil test of ${formatDate(unit.soilTest.sampledOn)}: lime ${unit.soilTest.limeTonsPerAcre} t/acre, P2O5 ${unit.soilTest.p2o5LbPerAcre} and K2O ${unit.soilTest.k2oLbPerAcre} lb/acre (${unit.soilTest.source}).`, steps);
    }

    if (p.family && unit.previousFamily === p.family) {
      add('rotation', `${unit.unitName} carried ${p.family} crops last season too; a third season of the same family invites its pests and diseases (common practice, no source). Consider a practice of another family.`);
    }
  }
  return plan;
}

/** A unit's parameters for the new season: the carried-over ones with every accepted change laid over them, in order. */
export function parametersWithChanges(unit: SeasonUnitPlan, changes: readonly SeasonChange[]): { steps?: Record<string, StepParameters> } {
  const steps: Record<string, StepParameters> = JSON.parse(JSON.stringify(unit.parameters.steps ?? {})) as Record<string, StepParameters>;
  for (const change of changes) {
    if (change.unitId !== unit.unitId || change.decision !== 'accepted') continue;
    for (const [key, patch] of Object.entries(change.steps)) steps[key] = { ...steps[key], ...patch, ...(patch.seedRatesLbPerAcre ? { seedRatesLbPerAcre: { ...steps[key]?.seedRatesLbPerAcre, ...patch.seedRatesLbPerAcre } } : {}) };
  }
  return { ...unit.parameters, steps };
}

/** Same crop family two seasons running on one plot (common practice, no source). */
export function rotationWarning(unitName: string, family: string | null, previousFamily: string | null): string | null {
  return family && family === previousFamily ? `${unitName} carries ${family} crops two seasons running: rotate to another crop family (common practice, no source).` : null;
}
