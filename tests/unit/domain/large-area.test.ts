import { describe, expect, it } from 'vitest';
import { DEFAULT_LARGE_AREA_ACRES, largeAreaThreshold, largeBoundaryMessage, largeUnitMessage } from '../../../shared/domain/large-area';

describe('large areas', () => {
  it('defaults to 20,000 acres and takes a firm’s own positive number', () => {
    expect(DEFAULT_LARGE_AREA_ACRES).toBe(20000); // the default (common practice, no source)
    expect(largeAreaThreshold({})).toBe(20000);
    expect(largeAreaThreshold(null)).toBe(20000);
    expect(largeAreaThreshold({ largeAreaAcres: 5000 })).toBe(5000);
    expect(largeAreaThreshold({ largeAreaAcres: 0 })).toBe(20000);
    expect(largeAreaThreshold({ largeAreaAcres: '900' })).toBe(20000);
  });

  it('asks about a boundary over the threshold, naming the field, and not at or under it', () => {
    expect(largeBoundaryMessage(11_612_345.6, 20000)).toBe(
      'The boundary measures 11,612,346 acres, more than the 20,000 acres this firm checks before saving. Check it was not drawn at too wide a zoom; to keep it anyway, confirm the large area (confirmLargeArea: true).',
    );
    expect(largeBoundaryMessage(20000, 20000)).toBeNull();
    expect(largeBoundaryMessage(640, 20000)).toBeNull();
  });

  it('asks about a unit larger than its property, or over the threshold when no boundary is drawn', () => {
    expect(largeUnitMessage(60, 40, 20000, 'Whole hillside')).toBe(
      '“Whole hillside” measures 60.0 acres, more than the whole property (40.0 acres). Check its outline; to keep it anyway, confirm the large area (confirmLargeArea: true).',
    );
    expect(largeUnitMessage(39.9, 40, 20000)).toBeNull();
    expect(largeUnitMessage(null, 40, 20000)).toBeNull(); // lines and points have no acres
    expect(largeUnitMessage(25000, null, 20000)).toMatch(/^The unit measures 25,000 acres, more than the 20,000 acres/);
    expect(largeUnitMessage(500, null, 20000)).toBeNull();
  });
});
