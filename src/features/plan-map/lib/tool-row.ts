/**
 * The plan map's drawing tools in one row: which tools stay in the row at a given width and which
 * go into the "More" menu. Pure, so the rule is unit-tested; the toolbar measures the widths.
 *
 * Every tool has a rank (lower = used more often). When the whole set does not fit, the row keeps
 * the best-ranked tools, in rank order, while they fit beside the "More" button; the rest go into
 * the menu. The row always shows its tools in their own order (areas, lines, points), never in rank
 * order, so a tool does not jump about as the width changes.
 */

/** A tool as the row sees it: its width in pixels, its family (a separator between families) and its rank. */
export interface ToolSlot {
  id: string;
  width: number;
  group: string;
  rank: number;
}

/** Gaps of the row: between two tools, and the width of a separator between two families. */
export interface RowSpacing {
  gap: number;
  separator: number;
}

/** Width of a row of tools (in the given order): tools, gaps and one separator wherever the family changes. */
export function rowWidth(tools: readonly ToolSlot[], spacing: RowSpacing): number {
  let width = 0;
  tools.forEach((t, i) => {
    if (i > 0) width += spacing.gap + (tools[i - 1]!.group !== t.group ? spacing.separator + spacing.gap : 0);
    width += t.width;
  });
  return width;
}

/**
 * Splits the tools between the row and the "More" menu for `available` pixels. Answers the ids in
 * the row and those in the menu, each in the tools' own order. The row holds everything when it all
 * fits; otherwise the best-ranked tools that fit beside the More button (`moreWidth`), stopping at
 * the first that does not fit.
 */
export function splitToolRow(tools: readonly ToolSlot[], available: number, moreWidth: number, spacing: RowSpacing): { row: string[]; more: string[] } {
  if (rowWidth(tools, spacing) <= available) return { row: tools.map((t) => t.id), more: [] };
  const budget = available - moreWidth - spacing.gap;
  const kept = new Set<string>();
  for (const tool of [...tools].sort((a, b) => a.rank - b.rank)) {
    const candidate = tools.filter((t) => kept.has(t.id) || t.id === tool.id);
    if (rowWidth(candidate, spacing) > budget) break;
    kept.add(tool.id);
  }
  return { row: tools.filter((t) => kept.has(t.id)).map((t) => t.id), more: tools.filter((t) => !kept.has(t.id)).map((t) => t.id) };
}
