/**
 * Our own symbols for the kinds of sign: simple line drawings on a 24 × 24 grid, drawn with the
 * current colour (stroke 2, round caps). Used by the log form's buttons, the legend and, rasterised,
 * the map.
 */
import type { ObservationKind } from '../../../../shared/domain/observations';

/** The inner SVG markup of each symbol (paths, circles, ellipses), without the <svg> element. */
export const KIND_SYMBOLS: Record<ObservationKind, string> = {
  // A trunk with the bark rubbed off: two upright lines and a pale scar between them.
  rub: '<path d="M9 3v18M15 3v18"/><path d="M9.5 9.5l5 2M9.5 12.5l5 2" stroke-width="1.5"/>',
  // A pawed patch of ground under an overhanging branch.
  scrape: '<path d="M3 6c4 0 7 1 10 3"/><path d="M11 8v3"/><ellipse cx="12" cy="17" rx="7" ry="3"/>',
  // Flattened grass: an oval with a smaller hollow inside.
  bed: '<ellipse cx="12" cy="13" rx="9" ry="6"/><ellipse cx="12" cy="13" rx="4.5" ry="2.5"/>',
  // A winding path in dashes.
  trail: '<path d="M4 21c2-5 10-4 8-9s6-6 8-9" stroke-dasharray="3 2.5"/>',
  // A dropped antler: a curved beam with two tines.
  shed: '<path d="M4 19c5 0 11-3 15-11"/><path d="M10 17l-1-6M15 13l0-6"/>',
  // A twig with a ragged, torn tip.
  browse: '<path d="M4 20L15 9"/><path d="M15 9l2-4 1 3 3-1-3 3"/><path d="M9 15l-3-2"/>',
  // Two split-hoof prints.
  tracks: '<path d="M6 4c-2 2-2 5 0 6M9 4c2 2 2 5 0 6"/><path d="M14 13c-2 2-2 5 0 6M17 13c2 2 2 5 0 6"/>',
  // A small pile of pellets.
  droppings: '<circle cx="8" cy="16" r="2"/><circle cx="13" cy="17" r="2"/><circle cx="17" cy="14" r="2"/><circle cx="11" cy="12" r="2"/>',
  // Ripples of water.
  'standing-water': '<path d="M3 9c3-2 6 2 9 0s6 2 9 0"/><path d="M3 14c3-2 6 2 9 0s6 2 9 0"/><path d="M3 19c3-2 6 2 9 0s6 2 9 0"/>',
  // A row of sprouts with gaps where seed failed.
  'thin-stand': '<path d="M3 20h18"/><path d="M5 20v-6M5 16l-2-2M5 16l2-2"/><path d="M14 20v-8M14 15l-2-2M14 15l2-2"/><path d="M9 19v.01M19 19v.01" stroke-width="3"/>',
  // A spreading plant with a warning mark.
  'invasive-plants': '<path d="M8 21V11M8 14c-3 0-5-2-5-5 3 0 5 2 5 5zM8 12c0-4 2-6 5-6 0 4-2 6-5 6z"/><path d="M18 9v6M18 18v.01" stroke-width="2.5"/>',
  // Something else: a circle with a dot.
  other: '<circle cx="12" cy="12" r="8"/><circle cx="12" cy="12" r="1.5" fill="currentColor"/>',
};

/** A whole SVG of a symbol in a given colour, on a round white badge (for the map). */
export function kindBadgeSvg(kind: ObservationKind, colour: string, sizePx = 32): string {
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" width="${sizePx}" height="${sizePx}" viewBox="-4 -4 32 32">` +
    `<circle cx="12" cy="12" r="15" fill="#FFFFFF" stroke="${colour}" stroke-width="2"/>` +
    `<g fill="none" stroke="${colour}" stroke-width="2" stroke-linecap="round" stroke-linejoin="round" color="${colour}">${KIND_SYMBOLS[kind]}</g></svg>`
  );
}
