/**
 * Starter practice library: the materials, rates and practices a new firm begins with; the
 * database seed loads them. Plain data.
 *
 * PRICES ARE INVENTED FOR THE DEMO: every package price, rate and minimum charge below is made up
 * for illustration and is not a quote from any supplier. Seed-lot purity and germination values are
 * invented too (plausible tag values). Herbicides are named by generic active ingredient only.
 *
 * Seeding rates: pure-stand rates come from the published ranges in REFERENCES.md (Cook & Gray
 * 2003, Alabama DCNR; UF/IFAS Taylor County Extension; McGinty, Texas AgriLife; Oklahoma State).
 * In a mix, each species takes a share of its pure-stand rate (`mixSharePct`), the usual way to
 * design a mix, so rate ÷ share is the pure-stand rate checked against the published range
 * (tests/unit/domain/starter-library.test.ts). Lead times are common practice unless noted.
 */
import type { MaterialDefinition, PracticeDefinition, PracticeStep, StepService } from './practice';
import type { ServiceRate } from './service-rates';

const COMMON = 'common practice, no source';

export const STARTER_MATERIALS: MaterialDefinition[] = [
  // ---- Seed (bulk lots; tag values invented) ----
  { key: 'seed-forage-radish', type: 'seed', name: 'Forage radish seed', species: 'forage radish', purityPct: 99, germinationPct: 90, packageSizeLb: 10, packagePriceCents: 3200 },
  { key: 'seed-turnip', type: 'seed', name: 'Purple-top turnip seed', species: 'turnip', purityPct: 99, germinationPct: 90, packageSizeLb: 10, packagePriceCents: 3800 },
  { key: 'seed-rape', type: 'seed', name: 'Dwarf Essex rape seed', species: 'rape', purityPct: 99, germinationPct: 90, packageSizeLb: 10, packagePriceCents: 3000 },
  { key: 'seed-white-clover', type: 'seed', name: 'Ladino white clover seed (raw)', species: 'white clover', purityPct: 99, germinationPct: 85, dormantPct: 5, packageSizeLb: 5, packagePriceCents: 4800 },
  { key: 'seed-chicory', type: 'seed', name: 'Forage chicory seed', species: 'forage chicory', purityPct: 98, germinationPct: 85, packageSizeLb: 5, packagePriceCents: 6000 },
  { key: 'seed-crimson-clover', type: 'seed', name: 'Crimson clover seed', species: 'crimson clover', purityPct: 99, germinationPct: 85, dormantPct: 5, packageSizeLb: 25, packagePriceCents: 8000 },
  { key: 'seed-oats', type: 'seed', name: 'Oats', species: 'oats', purityPct: 98, germinationPct: 85, packageSizeLb: 50, packagePriceCents: 2200 },
  { key: 'seed-wheat', type: 'seed', name: 'Wheat', species: 'wheat', purityPct: 98, germinationPct: 88, packageSizeLb: 50, packagePriceCents: 2000 },
  { key: 'seed-cereal-rye', type: 'seed', name: 'Cereal rye', species: 'cereal rye', purityPct: 98, germinationPct: 85, packageSizeLb: 50, packagePriceCents: 2600 },
  { key: 'seed-cowpeas', type: 'seed', name: 'Cowpeas', species: 'cowpeas', purityPct: 98, germinationPct: 85, packageSizeLb: 50, packagePriceCents: 6000 },
  { key: 'seed-grain-sorghum', type: 'seed', name: 'Grain sorghum', species: 'grain sorghum', purityPct: 98, germinationPct: 85, packageSizeLb: 25, packagePriceCents: 3000 },
  { key: 'seed-big-bluestem', type: 'seed', name: 'Big bluestem (bulk)', species: 'big bluestem', purityPct: 65, germinationPct: 60, dormantPct: 20, packageSizeLb: 1, packagePriceCents: 1800 },
  { key: 'seed-indiangrass', type: 'seed', name: 'Indiangrass (bulk)', species: 'indiangrass', purityPct: 70, germinationPct: 55, dormantPct: 25, packageSizeLb: 1, packagePriceCents: 1600 },
  { key: 'seed-little-bluestem', type: 'seed', name: 'Little bluestem (bulk)', species: 'little bluestem', purityPct: 60, germinationPct: 50, dormantPct: 30, packageSizeLb: 1, packagePriceCents: 2000 },
  { key: 'seed-switchgrass', type: 'seed', name: 'Switchgrass (bulk)', species: 'switchgrass', purityPct: 98, germinationPct: 60, dormantPct: 30, packageSizeLb: 1, packagePriceCents: 1000 },

  // ---- Lime ----
  { key: 'lime-ag-spread', type: 'lime', name: 'Agricultural lime, delivered and spread', enmLbPerTon: 400, pricing: { basis: 'per-ton', pricePerTonCents: 4800 } },
  { key: 'lime-pelletized-40', type: 'lime', name: 'Pelletized lime', enmLbPerTon: 600, pricing: { basis: 'bag', bagSizeLb: 40, bagPriceCents: 800 } },

  // ---- Fertilizer ----
  { key: 'fert-13-13-13', type: 'fertilizer', name: '13-13-13 fertilizer', grade: { nPct: 13, p2o5Pct: 13, k2oPct: 13 }, bagSizeLb: 50, bagPriceCents: 2600 },
  { key: 'fert-19-19-19', type: 'fertilizer', name: '19-19-19 fertilizer', grade: { nPct: 19, p2o5Pct: 19, k2oPct: 19 }, bagSizeLb: 50, bagPriceCents: 3000 },
  { key: 'fert-0-20-20', type: 'fertilizer', name: '0-20-20 fertilizer', grade: { nPct: 0, p2o5Pct: 20, k2oPct: 20 }, bagSizeLb: 50, bagPriceCents: 2800 },
  { key: 'fert-46-0-0', type: 'fertilizer', name: 'Urea 46-0-0', grade: { nPct: 46, p2o5Pct: 0, k2oPct: 0 }, bagSizeLb: 50, bagPriceCents: 3200 },

  // ---- Spray products (generic active ingredients only) ----
  { key: 'herb-glyphosate-41', type: 'herbicide', name: 'Glyphosate 41% (3 lb a.e./gal)', activeIngredient: 'glyphosate, isopropylamine salt 41% (3 lb a.e./gal)', lbAiPerGal: 3, restrictedUse: false, pricing: { basis: 'container', containerSizeGal: 2.5, containerPriceCents: 4800 } },
  { key: 'herb-triclopyr-amine', type: 'herbicide', name: 'Triclopyr amine (3 lb a.e./gal)', activeIngredient: 'triclopyr, triethylamine salt (3 lb a.e./gal)', lbAiPerGal: 3, restrictedUse: false, pricing: { basis: 'container', containerSizeGal: 2.5, containerPriceCents: 13500 } },
  { key: 'herb-triclopyr-ester', type: 'herbicide', name: 'Triclopyr ester (4 lb a.e./gal)', activeIngredient: 'triclopyr, butoxyethyl ester (4 lb a.e./gal)', lbAiPerGal: 4, restrictedUse: false, pricing: { basis: 'container', containerSizeGal: 1, containerPriceCents: 6500 } },
  { key: 'herb-imazapic', type: 'herbicide', name: 'Imazapic (2 lb a.e./gal)', activeIngredient: 'imazapic, ammonium salt (2 lb a.e./gal)', lbAiPerGal: 2, restrictedUse: false, pricing: { basis: 'per-gal', pricePerGalCents: 22000 } },
  { key: 'adj-nonionic-surfactant', type: 'adjuvant', name: 'Nonionic surfactant (80%)', activeIngredient: 'nonionic surfactant, 80% active', restrictedUse: false, pricing: { basis: 'per-gal', pricePerGalCents: 1800 } },

  // ---- Other items ----
  { key: 'item-shrub-seedlings', type: 'item', name: 'Bare-root native shrub seedlings (plum, dogwood, hazelnut)', itemLabel: 'seedling', packSize: 25, packLabel: 'bundle of 25', packPriceCents: 3000 },
  { key: 'item-licking-branch-rope', type: 'item', name: 'Natural-fiber rope for a licking branch', itemLabel: 'rope', packSize: 1, packLabel: 'each', packPriceCents: 600 },
  { key: 'item-scrape-attractant', type: 'item', name: 'Synthetic scrape attractant', itemLabel: 'bottle', packSize: 1, packLabel: 'bottle', packPriceCents: 1200 },
  { key: 'item-water-tub', type: 'item', name: 'Poly water tub, 150 gal', itemLabel: 'tub', packSize: 1, packLabel: 'each', packPriceCents: 16500 },
  { key: 'item-gravel', type: 'item', name: 'Crushed gravel', itemLabel: 'ton', packSize: 1, packLabel: 'ton', packPriceCents: 4500 },
  { key: 'item-no-entry-sign', type: 'item', name: 'Sanctuary no-entry signs', itemLabel: 'sign', packSize: 10, packLabel: 'pack of 10', packPriceCents: 2800 },
  { key: 'item-boundary-paint', type: 'item', name: 'Boundary-marking paint', itemLabel: 'gallon', packSize: 1, packLabel: 'gal can', packPriceCents: 3200 },
  { key: 'item-straw-bale', type: 'item', name: 'Straw bales for bare soil', itemLabel: 'bale', packSize: 1, packLabel: 'bale', packPriceCents: 700 },
  { key: 'item-stand-lifeline', type: 'item', name: 'Tree-stand lifeline (safety rope)', itemLabel: 'lifeline', packSize: 1, packLabel: 'each', packPriceCents: 4500 },
];

export const STARTER_RATES: ServiceRate[] = [
  { key: 'rate-soil-test', name: 'Soil sampling and lab test', category: 'fees', basis: 'per-each', unitPriceCents: 3500 },
  { key: 'rate-mobilization', name: 'Crew and equipment mobilization', category: 'fees', basis: 'per-each', unitPriceCents: 12500 },
  { key: 'rate-burn-plan', name: 'Burn plan, permits and notifications', category: 'fees', basis: 'per-each', unitPriceCents: 25000 },
  { key: 'rate-labor', name: 'Field crew labor', category: 'labor', basis: 'per-hour', unitPriceCents: 4800, minimumCents: 4800 },
  { key: 'rate-spray-tech', name: 'Licensed spray technician', category: 'labor', basis: 'per-hour', unitPriceCents: 6800, minimumCents: 6800 },
  { key: 'rate-chainsaw-operator', name: 'Chainsaw operator', category: 'labor', basis: 'per-hour', unitPriceCents: 7200, minimumCents: 28800 },
  { key: 'rate-trail-crew', name: 'Trail clearing crew', category: 'labor', basis: 'per-100-ft', unitPriceCents: 3000, minimumCents: 30000 },
  { key: 'rate-posting-labor', name: 'Boundary posting', category: 'labor', basis: 'per-100-ft', unitPriceCents: 900, minimumCents: 12000 },
  { key: 'rate-burn-crew', name: 'Prescribed-burn crew', category: 'labor', basis: 'per-acre', unitPriceCents: 3500, minimumCents: 70000 },
  { key: 'rate-tractor-disc', name: 'Tractor and disc', category: 'equipment', basis: 'per-acre', unitPriceCents: 6000, minimumCents: 12000 },
  { key: 'rate-spreader', name: 'Broadcast spreader', category: 'equipment', basis: 'per-acre', unitPriceCents: 1800, minimumCents: 3000 },
  { key: 'rate-cultipacker', name: 'Cultipacker', category: 'equipment', basis: 'per-acre', unitPriceCents: 1500, minimumCents: 3000 },
  { key: 'rate-rotary-mower', name: 'Tractor and rotary mower', category: 'equipment', basis: 'per-acre', unitPriceCents: 2500, minimumCents: 5000 },
  { key: 'rate-atv-sprayer', name: 'ATV boom sprayer', category: 'equipment', basis: 'per-acre', unitPriceCents: 2000, minimumCents: 4000 },
  { key: 'rate-backpack-sprayer', name: 'Backpack sprayer', category: 'equipment', basis: 'per-hour', unitPriceCents: 600 },
  { key: 'rate-native-drill', name: 'Native-seed no-till drill', category: 'equipment', basis: 'per-acre', unitPriceCents: 4500, minimumCents: 15000 },
  { key: 'rate-mini-excavator', name: 'Mini excavator', category: 'equipment', basis: 'per-hour', unitPriceCents: 9500, minimumCents: 38000 },
  { key: 'rate-brush-mower', name: 'Skid steer with brush mower', category: 'equipment', basis: 'per-100-ft', unitPriceCents: 2200, minimumCents: 35000 },
  { key: 'rate-firebreak-disc', name: 'Firebreak disking', category: 'equipment', basis: 'per-100-ft', unitPriceCents: 1200, minimumCents: 15000 },
];

const soilTest = (): PracticeStep => ({
  key: 'soil-test',
  kind: 'soil-test',
  name: 'Soil test',
  timing: { offsetEarliestDays: -365, offsetLatestDays: -120, source: 'soil test first, in time to lime: common practice, no source' },
  services: [{ rateKey: 'rate-soil-test' }],
});

const lime = (tonsPerAcre: number): PracticeStep => ({
  key: 'lime',
  kind: 'lime',
  name: 'Lime to the soil-test recommendation',
  dependsOn: ['soil-test'],
  timing: { offsetEarliestDays: -180, offsetLatestDays: -90, source: 'as early as possible, ideally 3–6 months before seeding: common practice, no source' },
  application: { type: 'lime', materialKey: 'lime-ag-spread', tonsPerAcre },
});

const burnDown = (): PracticeStep => ({
  key: 'burn-down',
  kind: 'spray',
  name: 'Burn-down spray',
  timing: { offsetEarliestDays: -14, offsetLatestDays: -7, source: '7–14 days before seeding: common practice, no source' },
  application: {
    type: 'spray',
    gpa: 15,
    tankGal: 25,
    products: [
      { materialKey: 'herb-glyphosate-41', rate: { kind: 'product', amountPerAcre: 2, unit: 'qt' } },
      { materialKey: 'adj-nonionic-surfactant', rate: { kind: 'solution', pctOfSpray: 0.25 } },
    ],
  },
  services: [
    { rateKey: 'rate-spray-tech', productivity: { hoursPerAcre: 0.5 } },
    { rateKey: 'rate-atv-sprayer', productivity: { hoursPerAcre: 0.5 } },
  ],
});

const disc = (): PracticeStep => ({
  key: 'disc',
  kind: 'till',
  name: 'Disc and prepare the seedbed',
  dependsOn: ['burn-down'],
  timing: { offsetEarliestDays: -5, offsetLatestDays: -1, source: COMMON },
  services: [
    { rateKey: 'rate-mobilization', quantity: 1 },
    { rateKey: 'rate-tractor-disc', productivity: { hoursPerAcre: 0.75 } },
    { rateKey: 'rate-labor', productivity: { hoursPerAcre: 0.75 } },
  ],
});

const fertilize = (materialKey: string, n: number, p: number, k: number): PracticeStep => ({
  key: 'fertilize',
  kind: 'fertilize',
  name: 'Fertilize at planting',
  dependsOn: ['soil-test'],
  timing: { offsetEarliestDays: -3, offsetLatestDays: 0, source: COMMON },
  application: { type: 'fertilizer', materialKey, nLbPerAcre: n, p2o5LbPerAcre: p, k2oLbPerAcre: k },
  services: [{ rateKey: 'rate-spreader', productivity: { hoursPerAcre: 0.25 } }],
});

const cultipack = (): PracticeStep => ({
  key: 'cultipack',
  kind: 'cultipack',
  name: 'Cultipack for seed-to-soil contact',
  dependsOn: ['seed'],
  timing: { offsetEarliestDays: 0, offsetLatestDays: 2, source: COMMON },
  services: [{ rateKey: 'rate-cultipacker', productivity: { hoursPerAcre: 0.3 } }],
});

const seedingLabor = (): StepService[] => [
  { rateKey: 'rate-spreader', productivity: { hoursPerAcre: 0.25 } },
  { rateKey: 'rate-labor', productivity: { hoursPerAcre: 0.3 } },
];


export const STARTER_PRACTICES: PracticeDefinition[] = [
  {
    key: 'fall-brassica-plot',
    name: 'Fall brassica plot',
    description: 'Forage radish, turnip and rape broadcast in late summer for late-fall and winter forage.',
    unitKinds: ['food-plot'],
    measure: 'acres',
    windowKey: 'brassica',
    anchorStepKey: 'seed',
    summary: { action: 'Plant', subject: 'fall brassicas', purpose: 'give deer a high-energy food source in late fall and winter' },
    steps: [
      soilTest(),
      lime(2),
      burnDown(),
      disc(),
      fertilize('fert-13-13-13', 40, 40, 40),
      {
        key: 'seed',
        kind: 'seed',
        name: 'Broadcast brassica seed',
        dependsOn: ['disc', 'fertilize', 'lime'],
        application: {
          type: 'seed',
          method: 'broadcast',
          components: [
            { materialKey: 'seed-forage-radish', rateLbPerAcre: 2.7, rateBasis: 'bulk', mixSharePct: 30 },
            { materialKey: 'seed-turnip', rateLbPerAcre: 1.65, rateBasis: 'bulk', mixSharePct: 30 },
            { materialKey: 'seed-rape', rateLbPerAcre: 4, rateBasis: 'bulk', mixSharePct: 40 },
          ],
        },
        services: seedingLabor(),
      },
      cultipack(),
      {
        key: 'topdress',
        kind: 'fertilize',
        name: 'Nitrogen topdress',
        dependsOn: ['seed'],
        timing: { offsetEarliestDays: 30, offsetLatestDays: 45, source: COMMON },
        application: { type: 'fertilizer', materialKey: 'fert-46-0-0', nLbPerAcre: 40, p2o5LbPerAcre: 0, k2oLbPerAcre: 0 },
        services: [{ rateKey: 'rate-spreader', productivity: { hoursPerAcre: 0.25 } }],
      },
    ],
  },
  {
    key: 'perennial-clover-chicory',
    name: 'Perennial clover and chicory plot',
    description: 'Ladino white clover with forage chicory, sown in fall and kept several years with mowing.',
    unitKinds: ['food-plot'],
    measure: 'acres',
    windowKey: 'clover',
    anchorStepKey: 'seed',
    summary: { action: 'Plant', subject: 'perennial clover and chicory', purpose: 'give deer protein-rich forage from spring through fall for several years' },
    steps: [
      soilTest(),
      lime(2),
      burnDown(),
      disc(),
      fertilize('fert-0-20-20', 0, 60, 60),
      {
        key: 'seed',
        kind: 'seed',
        name: 'Broadcast clover and chicory seed',
        dependsOn: ['disc', 'fertilize', 'lime'],
        application: {
          type: 'seed',
          method: 'broadcast',
          components: [
            { materialKey: 'seed-white-clover', rateLbPerAcre: 3, rateBasis: 'bulk', mixSharePct: 75 },
            { materialKey: 'seed-chicory', rateLbPerAcre: 1.25, rateBasis: 'bulk', mixSharePct: 25 },
          ],
        },
        services: seedingLabor(),
      },
      cultipack(),
      {
        key: 'mow',
        kind: 'mow',
        name: 'Mow to keep weeds from going to seed',
        dependsOn: ['seed'],
        timing: { offsetEarliestDays: 180, offsetLatestDays: 300, source: COMMON },
        services: [{ rateKey: 'rate-rotary-mower', productivity: { hoursPerAcre: 0.4 } }],
      },
    ],
  },
  {
    key: 'cereal-grain-plot',
    name: 'Cereal grain plot',
    description: 'Oats and wheat with crimson clover, broadcast in fall for green forage through winter.',
    unitKinds: ['food-plot'],
    measure: 'acres',
    windowKey: 'cereal-grain',
    anchorStepKey: 'seed',
    summary: { action: 'Plant', subject: 'fall cereal grains with clover', purpose: 'give deer palatable green forage from fall into early spring' },
    steps: [
      soilTest(),
      lime(1.5),
      { ...disc(), dependsOn: [] },
      fertilize('fert-19-19-19', 40, 40, 40),
      {
        key: 'seed',
        kind: 'seed',
        name: 'Broadcast grain and clover seed',
        dependsOn: ['disc', 'fertilize', 'lime'],
        application: {
          type: 'seed',
          method: 'broadcast',
          components: [
            { materialKey: 'seed-oats', rateLbPerAcre: 50, rateBasis: 'bulk', mixSharePct: 50 },
            { materialKey: 'seed-wheat', rateLbPerAcre: 33, rateBasis: 'bulk', mixSharePct: 30 },
            { materialKey: 'seed-crimson-clover', rateLbPerAcre: 4.6, rateBasis: 'bulk', mixSharePct: 20 },
          ],
        },
        services: seedingLabor(),
      },
      cultipack(),
    ],
  },
  {
    key: 'summer-legume-plot',
    name: 'Summer legume plot',
    description: 'Cowpeas with grain sorghum for summer forage and early-fall cover.',
    unitKinds: ['food-plot'],
    measure: 'acres',
    windowKey: 'cowpeas',
    anchorStepKey: 'seed',
    summary: { action: 'Plant', subject: 'summer legumes', purpose: 'give deer high-protein summer forage and early-fall cover' },
    steps: [
      soilTest(),
      lime(1.5),
      burnDown(),
      disc(),
      fertilize('fert-0-20-20', 0, 40, 40),
      {
        key: 'seed',
        kind: 'seed',
        name: 'Broadcast cowpeas and sorghum',
        dependsOn: ['disc', 'fertilize', 'lime'],
        application: {
          type: 'seed',
          method: 'broadcast',
          components: [
            { materialKey: 'seed-cowpeas', rateLbPerAcre: 39, rateBasis: 'bulk', mixSharePct: 65 },
            { materialKey: 'seed-grain-sorghum', rateLbPerAcre: 5.6, rateBasis: 'bulk', mixSharePct: 35 },
          ],
        },
        services: seedingLabor(),
      },
      { ...cultipack(), name: 'Disc lightly or drag to cover the seed' },
    ],
  },
  {
    key: 'native-grass-planting',
    name: 'Native warm-season grass planting',
    description: 'Big bluestem, indiangrass and little bluestem drilled in spring on killed sod, for bedding and fawning cover.',
    unitKinds: ['cover-planting', 'bedding-area'],
    measure: 'acres',
    windowKey: 'native-grass',
    anchorStepKey: 'seed',
    summary: { action: 'Plant', subject: 'native warm-season grasses', purpose: 'create bedding and fawning cover within a few growing seasons' },
    steps: [
      {
        ...burnDown(),
        key: 'fall-spray',
        name: 'Kill the sod the fall before',
        timing: { offsetEarliestDays: -240, offsetLatestDays: -150, source: 'spray cool-season sod the fall before: common practice, no source' },
      },
      { ...burnDown(), dependsOn: ['fall-spray'], timing: { offsetEarliestDays: -21, offsetLatestDays: -7, source: COMMON } },
      {
        key: 'seed',
        kind: 'seed',
        name: 'Drill native grass seed',
        dependsOn: ['burn-down'],
        application: {
          type: 'seed',
          method: 'drilled',
          rateMethod: 'drilled',
          components: [
            { materialKey: 'seed-big-bluestem', rateLbPerAcre: 2.1, rateBasis: 'pls', mixSharePct: 35 },
            { materialKey: 'seed-indiangrass', rateLbPerAcre: 1.8, rateBasis: 'pls', mixSharePct: 40 },
            { materialKey: 'seed-little-bluestem', rateLbPerAcre: 0.85, rateBasis: 'pls', mixSharePct: 25 },
          ],
        },
        services: [
          { rateKey: 'rate-mobilization', quantity: 1 },
          { rateKey: 'rate-native-drill', productivity: { hoursPerAcre: 0.5 } },
          { rateKey: 'rate-labor', productivity: { hoursPerAcre: 0.5 } },
        ],
      },
      {
        key: 'pre-emergence',
        kind: 'spray',
        name: 'Pre-emergence weed control at planting',
        dependsOn: ['seed'],
        timing: { offsetEarliestDays: 0, offsetLatestDays: 3, source: 'at or right after planting: from memory / common practice' },
        application: {
          type: 'spray',
          gpa: 15,
          tankGal: 25,
          products: [{ materialKey: 'herb-imazapic', rate: { kind: 'product', amountPerAcre: 6, unit: 'fl-oz' } }],
        },
        services: [
          { rateKey: 'rate-spray-tech', productivity: { hoursPerAcre: 0.5 } },
          { rateKey: 'rate-atv-sprayer', productivity: { hoursPerAcre: 0.5 } },
        ],
      },
      {
        key: 'mow',
        kind: 'mow',
        name: 'Mow weeds above the seedlings',
        dependsOn: ['seed'],
        timing: { offsetEarliestDays: 45, offsetLatestDays: 90, source: COMMON },
        services: [{ rateKey: 'rate-rotary-mower', productivity: { hoursPerAcre: 0.4 } }],
      },
    ],
  },
  {
    key: 'shrub-screen-planting',
    name: 'Shrub and screen planting',
    description: 'Bare-root native shrubs planted about 10 × 10 ft for soft mast and screening cover.',
    unitKinds: ['cover-planting', 'bedding-area'],
    measure: 'acres',
    windowKey: 'shrub-planting',
    anchorStepKey: 'plant',
    summary: { action: 'Plant', subject: 'native shrubs', purpose: 'grow soft mast and screening cover where deer travel and bed' },
    steps: [
      {
        ...burnDown(),
        key: 'site-spray',
        name: 'Kill competing sod the fall before',
        timing: { offsetEarliestDays: -150, offsetLatestDays: -60, source: COMMON },
      },
      {
        key: 'plant',
        kind: 'plant',
        name: 'Plant bare-root seedlings',
        dependsOn: ['site-spray'],
        // 10 × 10 ft spacing: 43,560 ft² ÷ 100 ft² ≈ 435 seedlings per acre (derived).
        application: { type: 'items', items: [{ materialKey: 'item-shrub-seedlings', quantity: 435, basis: 'per-acre' }] },
        services: [{ rateKey: 'rate-labor', productivity: { hoursPerAcre: 9 } }],
      },
      {
        key: 'survival-check',
        kind: 'inspect',
        name: 'Check seedling survival',
        dependsOn: ['plant'],
        timing: { offsetEarliestDays: 120, offsetLatestDays: 180, source: COMMON },
        services: [{ rateKey: 'rate-labor', productivity: { fixedHours: 1 } }],
      },
    ],
  },
  {
    key: 'switchgrass-screen',
    name: 'Switchgrass screen',
    description: 'A strip of switchgrass drilled in spring to hide stand approaches and field edges.',
    unitKinds: ['cover-planting'],
    measure: 'acres',
    windowKey: 'native-grass',
    anchorStepKey: 'seed',
    summary: { action: 'Plant', subject: 'switchgrass screen', purpose: 'hide stand approaches and field edges from deer' },
    steps: [
      { ...burnDown(), timing: { offsetEarliestDays: -21, offsetLatestDays: -7, source: COMMON } },
      {
        key: 'seed',
        kind: 'seed',
        name: 'Drill switchgrass',
        dependsOn: ['burn-down'],
        application: {
          type: 'seed',
          method: 'drilled',
          rateMethod: 'drilled',
          components: [{ materialKey: 'seed-switchgrass', rateLbPerAcre: 3.5, rateBasis: 'pls', mixSharePct: 100 }],
        },
        services: [
          { rateKey: 'rate-native-drill', productivity: { hoursPerAcre: 0.5 } },
          { rateKey: 'rate-labor', productivity: { hoursPerAcre: 0.5 } },
        ],
      },
      {
        key: 'mow',
        kind: 'mow',
        name: 'Mow weeds above the seedlings',
        dependsOn: ['seed'],
        timing: { offsetEarliestDays: 45, offsetLatestDays: 90, source: COMMON },
        services: [{ rateKey: 'rate-rotary-mower', productivity: { hoursPerAcre: 0.4 } }],
      },
    ],
  },
  {
    key: 'tsi-hinge-cut',
    name: 'Timber stand improvement and hinge-cutting',
    description: 'Hinge-cut and kill cull trees in the dormant season to open the canopy for browse and bedding cover.',
    unitKinds: ['timber', 'bedding-area'],
    measure: 'acres',
    windowKey: 'dormant-season',
    anchorStepKey: 'hinge-cut',
    summary: { action: 'Thin and hinge-cut', subject: 'timber', purpose: 'let sunlight reach the forest floor for browse and bedding cover' },
    steps: [
      {
        key: 'mark',
        kind: 'inspect',
        name: 'Mark crop trees and cull trees',
        timing: { offsetEarliestDays: -60, offsetLatestDays: -1, source: COMMON },
        services: [{ rateKey: 'rate-labor', productivity: { hoursPerAcre: 0.5 } }],
      },
      {
        key: 'hinge-cut',
        kind: 'hinge-cut',
        name: 'Hinge-cut selected trees',
        dependsOn: ['mark'],
        services: [
          { rateKey: 'rate-mobilization', quantity: 1 },
          { rateKey: 'rate-chainsaw-operator', productivity: { hoursPerAcre: 6 } },
        ],
      },
      {
        key: 'treat-culls',
        kind: 'spray',
        name: 'Hack-and-squirt cull trees',
        dependsOn: ['mark'],
        timing: { offsetEarliestDays: 0, offsetLatestDays: 14, source: COMMON },
        // Undiluted direct application: no spray volume or tank; product per acre from memory.
        application: { type: 'spray', products: [{ materialKey: 'herb-triclopyr-amine', rate: { kind: 'product', amountPerAcre: 1, unit: 'qt' } }] },
        services: [
          { rateKey: 'rate-spray-tech', productivity: { hoursPerAcre: 1 } },
        ],
      },
    ],
  },
  {
    key: 'invasive-shrub-control',
    name: 'Invasive-shrub control',
    description: 'Spot foliar spray of invasive shrubs (bush honeysuckle, privet, autumn olive) and cut-stump treatment of large stems.',
    unitKinds: ['timber', 'bedding-area', 'cover-planting', 'other-area'],
    measure: 'acres',
    windowKey: 'invasive-foliar',
    anchorStepKey: 'foliar-spray',
    summary: { action: 'Treat', subject: 'invasive shrubs', purpose: 'free native browse and cover from invasive shrubs' },
    steps: [
      {
        key: 'scout',
        kind: 'inspect',
        name: 'Scout and flag infested patches',
        timing: { offsetEarliestDays: -30, offsetLatestDays: -1, source: COMMON },
        services: [{ rateKey: 'rate-labor', productivity: { hoursPerAcre: 0.3 } }],
      },
      {
        key: 'foliar-spray',
        kind: 'spray',
        name: 'Spot-spray foliage',
        dependsOn: ['scout'],
        application: {
          type: 'spray',
          gpa: 30,
          tankGal: 25,
          treatedFraction: 0.35,
          products: [
            { materialKey: 'herb-triclopyr-amine', rate: { kind: 'solution', pctOfSpray: 2 } },
            { materialKey: 'adj-nonionic-surfactant', rate: { kind: 'solution', pctOfSpray: 0.25 } },
          ],
        },
        services: [
          { rateKey: 'rate-spray-tech', productivity: { hoursPerAcre: 3 } },
          { rateKey: 'rate-backpack-sprayer', productivity: { hoursPerAcre: 3 } },
        ],
      },
      {
        key: 'cut-stump',
        kind: 'chainsaw',
        name: 'Cut large stems and treat the stumps',
        dependsOn: ['scout'],
        timing: { offsetEarliestDays: 0, offsetLatestDays: 60, source: COMMON },
        application: { type: 'spray', products: [{ materialKey: 'herb-triclopyr-amine', rate: { kind: 'product', amountPerAcre: 1, unit: 'pt' } }] },
        services: [{ rateKey: 'rate-chainsaw-operator', productivity: { hoursPerAcre: 2 } }],
      },
      {
        key: 'follow-up',
        kind: 'inspect',
        name: 'Check for resprouts next season',
        dependsOn: ['foliar-spray'],
        timing: { offsetEarliestDays: 300, offsetLatestDays: 400, source: COMMON },
        services: [{ rateKey: 'rate-labor', productivity: { fixedHours: 2 } }],
      },
    ],
  },
  {
    key: 'mock-scrape',
    name: 'Mock scrape',
    description: 'A scrape raked to bare soil under a licking branch about 4–5½ ft high, before the rut.',
    unitKinds: ['mock-scrape'],
    measure: 'each',
    windowKey: 'mock-scrape',
    anchorStepKey: 'build',
    summary: {
      action: 'Build',
      subject: 'a mock scrape under a licking branch 4 to 5½ ft above the ground',
      subjectPlural: 'mock scrapes under licking branches 4 to 5½ ft above the ground',
      purpose: 'draw buck sign to a spot a camera and a stand can watch',
    },
    steps: [
      {
        key: 'build',
        kind: 'build',
        name: 'Rake the scrape and hang a licking branch',
        // Licking branch about 4–5½ ft above ground: common practice, no source.
        application: { type: 'items', items: [{ materialKey: 'item-licking-branch-rope', quantity: 1, basis: 'per-each' }] },
        services: [{ rateKey: 'rate-labor', productivity: { hoursPerEach: 0.75 } }],
      },
      {
        key: 'attractant',
        kind: 'scent',
        name: 'Add attractant only where state rules allow',
        dependsOn: ['build'],
        timing: { offsetEarliestDays: 0, offsetLatestDays: 3, source: COMMON },
        application: { type: 'items', items: [{ materialKey: 'item-scrape-attractant', quantity: 1, basis: 'per-each' }] },
      },
      {
        key: 'check',
        kind: 'inspect',
        name: 'Check the scrape for activity',
        dependsOn: ['build'],
        timing: { offsetEarliestDays: 14, offsetLatestDays: 21, source: COMMON },
        services: [{ rateKey: 'rate-labor', productivity: { hoursPerEach: 0.25 } }],
      },
    ],
  },
  {
    key: 'water-source',
    name: 'Water source',
    description: 'A poly tub dug in level near cover, filled by rain; checked for wet ground and permits first.',
    unitKinds: ['water-source'],
    measure: 'each',
    windowKey: 'summer-work',
    anchorStepKey: 'install',
    summary: { action: 'Install', subject: 'a dug-in water tub near cover', subjectPlural: 'dug-in water tubs near cover', purpose: 'give deer dependable water close to cover' },
    steps: [
      {
        key: 'site-check',
        kind: 'inspect',
        name: 'Check the site for wet ground, streams and permits',
        timing: { offsetEarliestDays: -30, offsetLatestDays: -1, source: COMMON },
        cautions: ['wetland'],
        services: [{ rateKey: 'rate-labor', productivity: { hoursPerEach: 0.5 } }],
      },
      {
        key: 'install',
        kind: 'water-work',
        name: 'Dig in and level the tub',
        dependsOn: ['site-check'],
        application: {
          type: 'items',
          items: [
            { materialKey: 'item-water-tub', quantity: 1, basis: 'per-each' },
            { materialKey: 'item-gravel', quantity: 2, basis: 'per-each' },
          ],
        },
        services: [
          { rateKey: 'rate-mobilization', quantity: 1 },
          { rateKey: 'rate-mini-excavator', productivity: { hoursPerEach: 3 } },
          { rateKey: 'rate-labor', productivity: { hoursPerEach: 4 } },
        ],
      },
    ],
  },
  {
    key: 'access-route-clearing',
    name: 'Access-route clearing',
    description: 'A quiet, low-impact route to stand sites, cleared of brush and low limbs well before the season.',
    unitKinds: ['access-route', 'firebreak'],
    measure: 'feet',
    windowKey: 'summer-work',
    anchorStepKey: 'clear',
    summary: { action: 'Clear', subject: 'low-impact access route to stand sites', purpose: 'let hunters reach their stands quietly without crossing bedding and feeding areas' },
    steps: [
      {
        key: 'flag',
        kind: 'inspect',
        name: 'Flag the route around bedding and feeding areas',
        timing: { offsetEarliestDays: -30, offsetLatestDays: -1, source: COMMON },
        services: [{ rateKey: 'rate-labor', productivity: { hoursPer100Ft: 0.05 } }],
      },
      {
        key: 'clear',
        kind: 'chainsaw',
        name: 'Clear brush and low limbs',
        dependsOn: ['flag'],
        application: { type: 'items', items: [{ materialKey: 'item-straw-bale', quantity: 0.25, basis: 'per-100-ft' }] },
        services: [
          { rateKey: 'rate-mobilization', quantity: 1 },
          { rateKey: 'rate-trail-crew', productivity: { hoursPer100Ft: 0.6 } },
          { rateKey: 'rate-brush-mower', productivity: { hoursPer100Ft: 0.1 } },
        ],
      },
    ],
  },
  {
    key: 'sanctuary-posting',
    name: 'Sanctuary posting',
    description: 'A sanctuary nobody enters, marked along its edge with paint and no-entry signs.',
    unitKinds: ['sanctuary'],
    measure: 'acres',
    windowKey: 'summer-work',
    anchorStepKey: 'post',
    summary: { action: 'Set aside', subject: 'sanctuary posted along its edge', purpose: 'leave deer one place on the property that nobody enters' },
    steps: [
      {
        key: 'post',
        kind: 'post-signs',
        name: 'Paint the edge and post no-entry signs',
        // One sign about every 200 ft of edge; paint about 1 gal per 3,300 ft: common practice, no source.
        application: {
          type: 'items',
          items: [
            { materialKey: 'item-no-entry-sign', quantity: 0.5, basis: 'per-100-ft' },
            { materialKey: 'item-boundary-paint', quantity: 0.03, basis: 'per-100-ft' },
          ],
        },
        services: [{ rateKey: 'rate-posting-labor', productivity: { hoursPer100Ft: 0.12 } }],
      },
    ],
  },
  {
    key: 'stand-site-preparation',
    name: 'Stand site preparation',
    description: 'Shooting lanes trimmed and a stand hung with a lifeline, weeks before the season.',
    unitKinds: ['stand-site'],
    measure: 'each',
    windowKey: 'summer-work',
    anchorStepKey: 'hang',
    summary: {
      action: 'Prepare',
      subject: 'a stand site with trimmed shooting lanes and a lifeline',
      subjectPlural: 'stand sites with trimmed shooting lanes and lifelines',
      purpose: 'hunt it safely with the least disturbance',
    },
    steps: [
      {
        key: 'trim',
        kind: 'chainsaw',
        name: 'Trim shooting lanes',
        timing: { offsetEarliestDays: -14, offsetLatestDays: 0, source: COMMON },
        services: [{ rateKey: 'rate-chainsaw-operator', productivity: { hoursPerEach: 1.5 } }],
      },
      {
        key: 'hang',
        kind: 'tree-stand',
        name: 'Hang the stand and lifeline',
        dependsOn: ['trim'],
        application: { type: 'items', items: [{ materialKey: 'item-stand-lifeline', quantity: 1, basis: 'per-each' }] },
        services: [{ rateKey: 'rate-labor', productivity: { hoursPerEach: 1.5 } }],
      },
    ],
  },
  {
    key: 'prescribed-burn',
    name: 'Prescribed burn',
    description: 'A planned dormant-season burn inside disked firebreaks to renew native grass and browse.',
    unitKinds: ['bedding-area', 'cover-planting', 'timber'],
    measure: 'acres',
    windowKey: 'burn-season',
    anchorStepKey: 'burn',
    summary: { action: 'Burn', subject: 'native cover under a written burn plan', purpose: 'renew native grass and browse and keep woody cover young' },
    steps: [
      {
        key: 'burn-plan',
        kind: 'inspect',
        name: 'Write the burn plan and get permits',
        timing: { offsetEarliestDays: -90, offsetLatestDays: -14, source: COMMON },
        services: [{ rateKey: 'rate-burn-plan', quantity: 1 }],
      },
      {
        key: 'firebreaks',
        kind: 'firebreak',
        name: 'Disc firebreaks around the unit',
        dependsOn: ['burn-plan'],
        timing: { offsetEarliestDays: -60, offsetLatestDays: -7, source: COMMON },
        services: [{ rateKey: 'rate-firebreak-disc', productivity: { hoursPer100Ft: 0.05 } }],
      },
      {
        key: 'burn',
        kind: 'burn',
        name: 'Burn on a day within the plan’s weather',
        dependsOn: ['burn-plan', 'firebreaks'],
        services: [
          { rateKey: 'rate-mobilization', quantity: 1 },
          { rateKey: 'rate-burn-crew', productivity: { hoursPerAcre: 1.5 } },
        ],
      },
    ],
  },
];

/** The starter practice with this key; throws when there is none. */
export function starterPractice(key: string): PracticeDefinition {
  const found = STARTER_PRACTICES.find((p) => p.key === key);
  if (!found) throw new Error(`No starter practice "${key}".`);
  return found;
}
