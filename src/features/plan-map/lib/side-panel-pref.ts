/**
 * Whether the plan map's side panel (aerial photos, observations, legend) starts open. A person's
 * own choice, kept in this browser's localStorage, wins; without one the panel starts open only on a
 * wide screen (at least 1440 px), where it leaves the map most of the width. Below that the map
 * needs the room, so the panel starts folded.
 */

/** The localStorage key of the person's choice ("open" or "folded"). */
export const SIDE_PANEL_KEY = 'browseline.planMap.sidePanel';
/** The media query of a screen wide enough to open the panel by default. */
export const SIDE_PANEL_WIDE_QUERY = '(min-width: 1440px)';

/** True when the panel starts open: the stored choice when there is one, else open on a wide screen. */
export function sidePanelStartsOpen(stored: string | null, wide: boolean): boolean {
  if (stored === 'open') return true;
  if (stored === 'folded') return false;
  return wide;
}

/** The stored choice of this browser, or null (no choice, or storage unavailable). */
export function readSidePanelChoice(): string | null {
  try {
    return window.localStorage.getItem(SIDE_PANEL_KEY);
  } catch {
    return null;
  }
}

/** Keeps the person's choice for the next visit; a browser without storage simply forgets it. */
export function storeSidePanelChoice(open: boolean): void {
  try {
    window.localStorage.setItem(SIDE_PANEL_KEY, open ? 'open' : 'folded');
  } catch {
    /* private mode or storage full: the choice lasts for this page only */
  }
}
