import { describe, expect, it } from 'vitest';
import { segmentHitsRect, segmentsCross } from '../../../templates/documents/kit/map-planar';

// Plain plane geometry (worked by hand, from memory of the usual orientation test).
const box = { x: 10, y: 10, w: 20, h: 10 }; // spans x 10–30, y 10–20

describe('segmentHitsRect', () => {
  it('counts a segment with an end inside the box', () => {
    expect(segmentHitsRect([15, 15], [100, 100], box)).toBe(true);
  });
  it('counts a segment passing right through the box', () => {
    expect(segmentHitsRect([0, 15], [40, 15], box)).toBe(true);
    expect(segmentHitsRect([20, 0], [20, 40], box)).toBe(true);
  });
  it('counts a diagonal that clips one corner', () => {
    // From (25, 5) to (35, 20): at x = 30 it is at y = 12.5, on the box's right edge; both ends are outside.
    expect(segmentHitsRect([25, 5], [35, 20], box)).toBe(true);
  });
  it('passes segments wholly to one side', () => {
    expect(segmentHitsRect([0, 0], [9, 40], box)).toBe(false);
    expect(segmentHitsRect([31, 0], [50, 40], box)).toBe(false);
    expect(segmentHitsRect([0, 5], [40, 9], box)).toBe(false);
    expect(segmentHitsRect([0, 21], [40, 30], box)).toBe(false);
  });
  it('passes a diagonal that misses a corner though its extent overlaps the box', () => {
    // From (0, 15) to (15, 0): at x = 10 it is at y = 5, below the box.
    expect(segmentHitsRect([0, 15], [15, 0], box)).toBe(false);
  });
});

describe('segmentsCross', () => {
  it('crosses an X and not parallel or end-touching segments', () => {
    expect(segmentsCross([0, 0], [10, 10], [0, 10], [10, 0])).toBe(true);
    expect(segmentsCross([0, 0], [10, 0], [0, 1], [10, 1])).toBe(false);
    expect(segmentsCross([0, 0], [10, 0], [10, 0], [10, 10])).toBe(false);
  });
});
