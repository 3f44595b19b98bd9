/**
 * The check against absurd sizes: a boundary drawn at a continental zoom (millions of acres) or a
 * unit larger than the property it belongs to is kept only when the person confirms it. The same
 * rule answers the API's 422 and the plan map's confirmation dialog.
 */

/**
 * Property size above which saving asks for a confirmation, acres, unless the firm sets its own
 * (`settings.largeAreaAcres`). Common practice, no source: the largest properties our consultants
 * plan are a few thousand acres, so 20,000 leaves room for big ranches and catches a boundary
 * drawn at the map's opening zoom.
 */
export const DEFAULT_LARGE_AREA_ACRES = 20000;

/** The body field that confirms a large area (the 422 names it). */
export const CONFIRM_LARGE_AREA_FIELD = 'confirmLargeArea';

/** "11,612,345 acres", "20,000 acres", "312.5 acres": whole acres from a thousand up. */
function formatAcres(acres: number): string {
  return `${acres >= 1000 ? Math.round(acres).toLocaleString('en-US') : acres.toFixed(1)} acres`;
}

/** The firm's threshold: its own setting when it is a positive number, else the default. */
export function largeAreaThreshold(settings: Record<string, unknown> | null | undefined): number {
  const value = settings?.largeAreaAcres;
  return typeof value === 'number' && Number.isFinite(value) && value > 0 ? value : DEFAULT_LARGE_AREA_ACRES;
}

/** A boundary larger than the firm's threshold: the sentence to show, or null when it is not. */
export function largeBoundaryMessage(acres: number, thresholdAcres: number): string | null {
  if (!(acres > thresholdAcres)) return null;
  return `The boundary measures ${formatAcres(acres)}, more than the ${formatAcres(thresholdAcres)} this firm checks before saving. Check it was not drawn at too wide a zoom; to keep it anyway, confirm the large area (${CONFIRM_LARGE_AREA_FIELD}: true).`;
}

/**
 * A unit larger than its property (or, where no boundary is drawn yet, than the firm's threshold):
 * the sentence to show, or null when it is not.
 */
export function largeUnitMessage(unitAcres: number | null, propertyAcres: number | null, thresholdAcres: number, unitName?: string): string | null {
  if (unitAcres === null) return null;
  const subject = unitName ? `“${unitName}”` : 'The unit';
  if (propertyAcres !== null && propertyAcres > 0) {
    if (!(unitAcres > propertyAcres)) return null;
    return `${subject} measures ${formatAcres(unitAcres)}, more than the whole property (${formatAcres(propertyAcres)}). Check its outline; to keep it anyway, confirm the large area (${CONFIRM_LARGE_AREA_FIELD}: true).`;
  }
  if (!(unitAcres > thresholdAcres)) return null;
  return `${subject} measures ${formatAcres(unitAcres)}, more than the ${formatAcres(thresholdAcres)} this firm checks before saving. Check it was not drawn at too wide a zoom; to keep it anyway, confirm the large area (${CONFIRM_LARGE_AREA_FIELD}: true).`;
}
