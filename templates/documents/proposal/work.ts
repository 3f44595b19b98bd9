/**
 * The work, unit by unit in plain words.
 */
import { KIND_STYLES } from '../../../shared/domain/unit-kinds';
import type { DisplayUnits } from '../../../shared/units';
import { DOC_COLORS, FONT_HEADING } from '../kit/layout';
import type { Content } from 'pdfmake/interfaces';
import { sizeOf, swatch } from './format';
import type { DocGroup } from './input';

/** The work, unit by unit in plain words, with each unit's kind and size. */
export function workSection(groups: readonly DocGroup[], units: DisplayUnits): Content[] {
  if (groups.length === 0) return [];
  const blocks: Content[] = groups.map((g) => {
    const kindLabel = g.kind ? KIND_STYLES[g.kind].label : '';
    const size = sizeOf(g, units);
    return {
      unbreakable: true,
      margin: [0, 0, 0, 10],
      stack: [
        {
          columns: [
            swatch(g.kind, 3),
            { width: '*', text: g.label, font: FONT_HEADING, bold: true, fontSize: 10.5, color: DOC_COLORS.ink },
            {
              width: 'auto',
              text: [kindLabel, size].filter(Boolean).join(' · '),
              fontSize: 9,
              color: DOC_COLORS.slate,
              alignment: 'right',
              margin: [0, 1.5, 0, 0],
            },
          ],
          columnGap: 8,
          margin: [0, 0, 0, 3],
        },
        g.summaries.length > 0
          ? { ul: g.summaries.map((s) => ({ text: s, fontSize: 9.5, margin: [0, 0, 0, 1.5] })), markerColor: DOC_COLORS.moss, margin: [24, 0, 0, 0] }
          : { text: 'No work described for this unit.', style: 'small', margin: [24, 0, 0, 0] },
      ],
    };
  });
  return [{ text: 'The work, unit by unit', style: 'h2' }, ...blocks];
}
