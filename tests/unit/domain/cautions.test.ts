import { describe, expect, it } from 'vitest';
import { CAUTIONS, CAUTION_IDS, DEFERENCE, cautionsForPractice } from '../../../shared/domain/cautions';
import type { MaterialDefinition } from '../../../shared/domain/practice';
import { STARTER_MATERIALS, STARTER_PRACTICES, starterPractice } from '../../../shared/domain/starter-library';

const idsOf = (key: string, materials: readonly MaterialDefinition[] = STARTER_MATERIALS) => cautionsForPractice(starterPractice(key), materials).map((c) => c.id);

describe('caution catalogue', () => {
  it('has every caution, each deferring to local codes, state wildlife rules and licensed practice', () => {
    expect(Object.keys(CAUTIONS).sort()).toEqual([...CAUTION_IDS].sort());
    for (const id of CAUTION_IDS) expect(CAUTIONS[id].text.endsWith(DEFERENCE)).toBe(true);
    expect(DEFERENCE).toMatch(/local codes, state wildlife rules and licensed practice/i);
  });

  it('says what the product brief asks for each hazard (PRODUCT.md, "Cautions the product shows")', () => {
    expect(CAUTIONS.herbicide.text).toMatch(/label is the law/);
    expect(CAUTIONS.herbicide.text).toMatch(/drift/);
    expect(CAUTIONS.herbicide.text).toMatch(/setbacks from water/);
    expect(CAUTIONS.herbicide.text).toMatch(/protective equipment/);
    expect(CAUTIONS['restricted-use'].text).toMatch(/certified applicator/);
    expect(CAUTIONS['tree-stand'].text).toMatch(/full-body harness/);
    expect(CAUTIONS.burning.text).toMatch(/burn plan.*permits.*trained crew/);
    expect(CAUTIONS.wetland.text).toMatch(/permits/);
    expect(CAUTIONS['deer-scent-baiting'].text).toMatch(/chronic wasting disease/);
    expect(CAUTIONS.chainsaw.text).toMatch(/trained operators/);
  });
});

describe('cautionsForPractice', () => {
  it('follows the kinds of the practice steps', () => {
    expect(idsOf('fall-brassica-plot')).toEqual(['herbicide']);
    expect(idsOf('tsi-hinge-cut')).toEqual(['herbicide', 'chainsaw', 'hinge-cutting']);
    expect(idsOf('stand-site-preparation')).toEqual(['chainsaw', 'tree-stand']);
    expect(idsOf('prescribed-burn')).toEqual(['burning']);
    expect(idsOf('water-source')).toEqual(['wetland']);
    expect(idsOf('mock-scrape')).toEqual(['deer-scent-baiting']);
    expect(idsOf('sanctuary-posting')).toEqual([]);
  });

  it('adds the restricted-use caution when a sprayed product is restricted use', () => {
    const restricted = STARTER_MATERIALS.map((m) => (m.key === 'herb-glyphosate-41' && m.type === 'herbicide' ? { ...m, restrictedUse: true } : m));
    expect(idsOf('fall-brassica-plot', restricted)).toEqual(['herbicide', 'restricted-use']);
  });

  it('gives the herbicide caution to every starter practice that sprays', () => {
    for (const practice of STARTER_PRACTICES) {
      const sprays = practice.steps.some((s) => s.kind === 'spray' || s.application?.type === 'spray');
      expect(cautionsForPractice(practice, STARTER_MATERIALS).some((c) => c.id === 'herbicide'), practice.key).toBe(sprays);
    }
  });
});
