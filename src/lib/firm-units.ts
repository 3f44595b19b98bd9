/** The signed-in firm's display units (its profile's `areaUnit` and `lengthUnit`), recorded when the signed-in user is read. */
import { DEFAULT_DISPLAY_UNITS, type DisplayUnits } from '../../shared/units';

let current: DisplayUnits = DEFAULT_DISPLAY_UNITS;

/** Records the firm's units from the session user (absent or unknown: acres and feet). */
export function setFirmUnits(user: { firmAreaUnit?: string | null; firmLengthUnit?: string | null } | null | undefined): void {
  current = { areaUnit: user?.firmAreaUnit === 'hectares' ? 'hectares' : 'acres', lengthUnit: user?.firmLengthUnit === 'metres' ? 'metres' : 'feet' };
}

/** The firm's units as last read from the server. */
export function firmUnits(): DisplayUnits {
  return current;
}
