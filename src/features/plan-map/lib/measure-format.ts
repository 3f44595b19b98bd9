/** How the plan map writes measures: feet and miles for lengths, acres and hectares for areas (in the firm's units). */
import { areaIn, lengthIn } from '../../../../shared/units';
import { firmUnits } from '../../../lib/firm-units';

const num = (v: number, digits: number) => v.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits });

/** "1,234 ft" (whole feet), or "376 m" when the firm shows metres. */
export const formatFeet = (ft: number): string => (firmUnits().lengthUnit === 'metres' ? `${num(Math.round(lengthIn(ft, 'metres')), 0)} m` : `${num(Math.round(ft), 0)} ft`);

/** "0.23 mi" (two decimals; three under a tenth of a mile). */
export const formatMiles = (mi: number): string => `${num(mi, mi < 0.1 ? 3 : 2)} mi`;

/** "12.34 ac" (two decimals under 100 acres, one above), or "4.99 ha" when the firm shows hectares. */
export const formatAcresShort = (acres: number): string => (firmUnits().areaUnit === 'hectares' ? formatHectares(areaIn(acres, 'hectares')) : `${num(acres, acres < 100 ? 2 : 1)} ac`);

/** True when the firm shows acres and feet (the readouts then add hectares and miles beside them). */
export const showsImperial = (): boolean => firmUnits().areaUnit === 'acres';

/** "4.99 ha". */
export const formatHectares = (ha: number): string => `${num(ha, ha < 100 ? 2 : 1)} ha`;

/** "42.0 %" (one decimal). */
export const formatPct = (pct: number): string => `${num(pct, 1)} %`;
