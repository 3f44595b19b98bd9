/** Library materials from the API's flat shape to the domain's definitions, and back. */
import crypto from 'node:crypto';
import type { MaterialDefinition } from '../../shared/domain/practice';
import type { MaterialCreateInput } from '../../shared/schemas/library';
import { validateMaterialDefinition } from '../../shared/domain/practice';

/** A new key for a firm's entry: the name as a slug plus a short random suffix. */
export function newLibraryKey(prefix: string, name: string): string {
  const slug = name.toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '').slice(0, 40);
  return `${prefix}-${slug || 'entry'}-${crypto.randomBytes(3).toString('hex')}`;
}

/** The domain definition of a material given through the API (validated by the domain too). */
export function toMaterialDefinition(input: MaterialCreateInput, key: string): MaterialDefinition & Record<string, unknown> {
  let definition: MaterialDefinition & Record<string, unknown>;
  switch (input.kind) {
    case 'seed':
      definition = { key, type: 'seed', name: input.name, species: input.species, purityPct: input.purityPct, germinationPct: input.germinationPct, ...(input.dormantPct !== undefined ? { dormantPct: input.dormantPct } : {}), packageSizeLb: input.packageSizeLb, packagePriceCents: input.packagePriceCents, ...(input.rateLbPerAcre !== undefined ? { rateLbPerAcre: input.rateLbPerAcre } : {}) };
      break;
    case 'lime':
      definition = { key, type: 'lime', name: input.name, ...(input.enmLbPerTon !== undefined ? { enmLbPerTon: input.enmLbPerTon } : {}), pricing: input.pricing };
      break;
    case 'fertilizer':
      definition = { key, type: 'fertilizer', name: input.name, grade: input.grade, bagSizeLb: input.bagSizeLb, bagPriceCents: input.bagPriceCents };
      break;
    case 'herbicide':
      definition = {
        key,
        type: input.adjuvant ? 'adjuvant' : 'herbicide',
        name: input.name,
        activeIngredient: input.activeIngredient,
        ...(input.lbAiPerGal !== undefined ? { lbAiPerGal: input.lbAiPerGal } : {}),
        restrictedUse: input.restrictedUse,
        ...(input.epaRegNo ? { epaRegNo: input.epaRegNo } : {}),
        pricing: input.pricing,
        ...(input.rateLbAiPerAcre !== undefined ? { rateLbAiPerAcre: input.rateLbAiPerAcre } : {}),
        ...(input.carrierGpa !== undefined ? { carrierGpa: input.carrierGpa } : {}),
        ...(input.plantBackDays !== undefined ? { plantBackDays: input.plantBackDays } : {}),
      };
      break;
    case 'other':
      definition = { key, type: 'item', name: input.name, itemLabel: input.itemLabel, packSize: input.packSize, packLabel: input.packLabel, packPriceCents: input.packPriceCents };
      break;
  }
  validateMaterialDefinition(definition, 'material');
  return definition;
}
