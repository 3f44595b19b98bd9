/**
 * Cautions the product shows where work is planned. Plain text, our own wording. Every caution
 * ends by deferring to local codes, state wildlife rules and licensed practice.
 */
import type { MaterialDefinition, PracticeDefinition, StepKind } from './practice';

export const CAUTION_IDS = [
  'herbicide',
  'restricted-use',
  'chainsaw',
  'hinge-cutting',
  'tree-stand',
  'burning',
  'wetland',
  'deer-scent-baiting',
] as const;
export type CautionId = (typeof CAUTION_IDS)[number];

export interface Caution {
  id: CautionId;
  title: string;
  text: string;
}

/** The sentence every caution ends with. */
export const DEFERENCE =
  'Local codes, state wildlife rules and licensed practice come first; check them before the work starts.';

export const CAUTIONS: Record<CautionId, Caution> = {
  herbicide: {
    id: 'herbicide',
    title: 'Herbicide work',
    text:
      'Read and follow the product label: the label is the law. Mind drift and wind, keep the setbacks from water the label gives, and wear the protective equipment it lists. ' +
      DEFERENCE,
  },
  'restricted-use': {
    id: 'restricted-use',
    title: 'Restricted-use product',
    text:
      'A restricted-use pesticide may only be bought and applied by a certified applicator, or under one’s direct supervision, with the records the state requires. ' +
      DEFERENCE,
  },
  chainsaw: {
    id: 'chainsaw',
    title: 'Chainsaw work',
    text:
      'Chainsaw work causes serious injuries. Only trained operators should run a saw, with chaps, helmet, eye and hearing protection, gloves and boots, and never alone. ' +
      DEFERENCE,
  },
  'hinge-cutting': {
    id: 'hinge-cutting',
    title: 'Hinge-cutting',
    text:
      'Hinge-cut trees can split, kick back or fall unpredictably. Only trained, equipped operators should hinge-cut, keeping clear of the fall zone and of hung-up trees. ' +
      DEFERENCE,
  },
  'tree-stand': {
    id: 'tree-stand',
    title: 'Tree stands',
    text:
      'Falls from tree stands injure and kill hunters every season. Wear a full-body harness connected to the tree from the moment you leave the ground until you are back down. ' +
      DEFERENCE,
  },
  burning: {
    id: 'burning',
    title: 'Prescribed burning',
    text:
      'A prescribed burn needs a written burn plan, the permits and notifications your state requires, firebreaks, suitable weather and a trained crew with equipment to hold the fire. ' +
      DEFERENCE,
  },
  wetland: {
    id: 'wetland',
    title: 'Wetlands and streams',
    text:
      'Digging, filling or clearing in wetlands, streams or their banks may need federal, state or local permits; ask before the work is scheduled. ' +
      DEFERENCE,
  },
  'deer-scent-baiting': {
    id: 'deer-scent-baiting',
    title: 'Deer scents, baiting and feeding',
    text:
      'Many states restrict deer scents, baiting and feeding (also for camera surveys), especially where chronic wasting disease has been found; some ban natural deer urine lures. Check the current rules for the county before using any attractant. ' +
      DEFERENCE,
  },
};

/** Cautions implied by each kind of step. */
export const STEP_KIND_CAUTIONS: Partial<Record<StepKind, CautionId[]>> = {
  spray: ['herbicide'],
  chainsaw: ['chainsaw'],
  'hinge-cut': ['hinge-cutting', 'chainsaw'],
  burn: ['burning'],
  'tree-stand': ['tree-stand'],
  'water-work': ['wetland'],
  scent: ['deer-scent-baiting'],
};

/** The cautions of a practice, from its steps' kinds, explicit step cautions and restricted-use products, in catalogue order. */
export function cautionsForPractice(practice: PracticeDefinition, materials: readonly MaterialDefinition[] = []): Caution[] {
  const ids = new Set<CautionId>();
  for (const step of practice.steps) {
    for (const id of STEP_KIND_CAUTIONS[step.kind] ?? []) ids.add(id);
    for (const id of step.cautions ?? []) ids.add(id);
    if (step.application?.type === 'spray') {
      ids.add('herbicide');
      for (const product of step.application.products) {
        const material = materials.find((m) => m.key === product.materialKey);
        if (material && (material.type === 'herbicide' || material.type === 'adjuvant') && material.restrictedUse) ids.add('restricted-use');
      }
    }
  }
  return CAUTION_IDS.filter((id) => ids.has(id)).map((id) => CAUTIONS[id]);
}
