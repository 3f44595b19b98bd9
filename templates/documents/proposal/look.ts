/**
 * Colours and page measures of the proposal document.
 */
import { DOC_COLORS } from '../kit/layout';

/** DESIGN.md token "ochre": attention, drafts. Used for borders and marks only (too light for text). */
export const OCHRE = '#C99A2E';
/** A pale wash of ochre behind the draft banner (ink on it passes WCAG AA). */
export const OCHRE_TINT = '#FBF5E6';
/** A pale wash of moss behind the approval record (ink on it passes WCAG AA). */
export const MOSS_TINT = '#EEF3EA';
/** Greyed text of options that are not included (slate is the lightest text colour that passes AA). */
export const GREYED = DOC_COLORS.slate;

export { CONTENT_WIDTH_PT } from '../kit/layout';
/** US Letter height less pageFrame's top (70) and bottom (60) margins. */
export const PAGE_INNER_HEIGHT_PT = 792 - 70 - 60;
/** The plan map is never drawn shorter or taller than these. */
export const MAP_MIN_HEIGHT_PT = 220;
export const MAP_MAX_HEIGHT_PT = 430;
/** Room a group's header row needs below it: itself and one line row. */
export const GROUP_ROW_KEEP_PT = 52;
/** Id prefix of a unit's header row in the price table (the page-break rule finds them by it). */
export const GROUP_ROW_ID = 'proposal-group-row-';
