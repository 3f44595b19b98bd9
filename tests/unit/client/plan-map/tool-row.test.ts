import { describe, expect, it } from 'vitest';
import { rowWidth, splitToolRow, type ToolSlot } from '../../../../src/features/plan-map/lib/tool-row';
import { sidePanelStartsOpen } from '../../../../src/features/plan-map/lib/side-panel-pref';

const spacing = { gap: 4, separator: 1 };
// Row order: two areas, a line, a point; ranks say the point is used more than the second area.
const tools: ToolSlot[] = [
  { id: 'food-plot', width: 80, group: 'areas', rank: 1 },
  { id: 'other-area', width: 90, group: 'areas', rank: 9 },
  { id: 'access-route', width: 100, group: 'lines', rank: 3 },
  { id: 'stand-site', width: 70, group: 'points', rank: 2 },
];

describe('the drawing tools in one row', () => {
  it('adds a gap between tools and a separator with its gaps where the family changes', () => {
    // 80 + 4 + 90 | 4 + 1 + 4 | 100 | 4 + 1 + 4 | 70 (arithmetic of the layout, common practice, no source)
    expect(rowWidth(tools, spacing)).toBe(80 + 4 + 90 + 9 + 100 + 9 + 70);
    expect(rowWidth([], spacing)).toBe(0);
  });

  it('keeps every tool in the row when they all fit, with no More menu', () => {
    expect(splitToolRow(tools, 362, 50, spacing)).toEqual({ row: ['food-plot', 'other-area', 'access-route', 'stand-site'], more: [] });
  });

  it('keeps the best-ranked tools beside More, shown in their own order, and moves the rest into the menu', () => {
    // Budget 300 − 50 − 4 = 246: food plot + stand site = 80 + 9 + 70 = 159; with the access route 159 + 9 + 100 + … = 268 > 246.
    expect(splitToolRow(tools, 300, 50, spacing)).toEqual({ row: ['food-plot', 'stand-site'], more: ['other-area', 'access-route'] });
    // One pixel short of the whole row: the lowest rank goes first.
    const all = rowWidth(tools, spacing);
    expect(splitToolRow(tools, all - 1, 50, spacing).more).toContain('other-area');
  });

  it('answers an empty row when not even the first tool fits beside More (everything is in the menu)', () => {
    expect(splitToolRow(tools, 100, 50, spacing)).toEqual({ row: [], more: ['food-plot', 'other-area', 'access-route', 'stand-site'] });
  });
});

describe('the side panel at first open', () => {
  it('opens on a wide screen and stays folded on a narrower one unless the person chose otherwise', () => {
    expect(sidePanelStartsOpen(null, true)).toBe(true);
    expect(sidePanelStartsOpen(null, false)).toBe(false);
    expect(sidePanelStartsOpen('open', false)).toBe(true);
    expect(sidePanelStartsOpen('folded', true)).toBe(false);
    expect(sidePanelStartsOpen('something else', false)).toBe(false);
  });
});
