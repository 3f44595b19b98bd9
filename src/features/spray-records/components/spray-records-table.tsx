import { Link } from 'react-router-dom';
import type { SprayRecordDto } from '../../../../shared/schemas/spray-records';
import { formatDay } from '../../../lib/firm-clock';
import { formatNumber } from '../../../lib/format';
import { paths } from '../../../config/paths';

const AMOUNT_UNIT_WORDS: Record<string, string> = { gal: 'gal', qt: 'qt', pt: 'pt', 'fl-oz': 'fl oz', lb: 'lb', oz: 'oz' };

/** Degrees to five places (about a metre), latitude first. */
const position = (r: SprayRecordDto) => (r.latitude === null || r.longitude === null ? null : `${r.latitude.toFixed(5)}, ${r.longitude.toFixed(5)}`);

/**
 * One row per product applied with every field 7 CFR 110.3 asks for (product, EPA Reg. No., total amount,
 * location, crop or site, area, date, applicator and certification number) plus wind and temperature.
 * The rows of `highlightTaskId` are marked (opened from a task).
 */
export function SprayRecordsTable({ records, highlightTaskId }: { records: SprayRecordDto[]; highlightTaskId?: number | null }) {
  return (
    <div className="overflow-x-auto rounded-md border border-rule bg-card">
      <table className="w-full text-sm tabular-nums print:text-xs">
        <caption className="sr-only">Spray records</caption>
        <thead className="border-b border-rule text-left text-slate">
          <tr>
            <th scope="col" className="px-3 py-2">Date</th>
            <th scope="col" className="px-3 py-2">Location</th>
            <th scope="col" className="px-3 py-2">Crop or site, area</th>
            <th scope="col" className="px-3 py-2">Product and EPA Reg. No.</th>
            <th scope="col" className="px-3 py-2 text-right">Total applied</th>
            <th scope="col" className="px-3 py-2">Applicator, cert. no.</th>
            <th scope="col" className="px-3 py-2">Weather</th>
          </tr>
        </thead>
        <tbody>
          {records.map((r) => {
            const marked = highlightTaskId !== null && highlightTaskId !== undefined && r.taskId === highlightTaskId;
            const where = position(r);
            return (
              <tr key={r.id} className={`border-t border-rule align-top ${marked ? 'bg-ochre/10' : ''}`} aria-current={marked ? 'true' : undefined} data-testid="spray-record-row">
                <td className="whitespace-nowrap px-3 py-2">
                  {formatDay(r.appliedOn)}
                  <span className="block text-xs text-slate">keep until {formatDay(r.keepUntil)}</span>
                </td>
                <td className="px-3 py-2">
                  {r.propertyName} · {r.unitName}
                  {where ? <span className="block text-xs text-slate">{where}</span> : null}
                  {r.taskId ? (
                    <Link to={`${paths.schedule}?task=${r.taskId}`} className="block text-xs text-moss underline print:hidden">
                      Open the task
                    </Link>
                  ) : null}
                </td>
                <td className="px-3 py-2">
                  {r.cropOrSite}
                  <span className="block text-xs text-slate">
                    {formatNumber(r.areaTreated, 2)} {r.areaUnit}
                  </span>
                </td>
                <td className="px-3 py-2">
                  {r.productName}
                  {r.restrictedUse ? <span className="ml-2 rounded bg-clay/10 px-1.5 text-xs font-semibold text-[#A04A25]">restricted use</span> : null}
                  <span className="block text-xs text-slate">EPA Reg. No. {r.epaRegNo ?? 'not recorded'}</span>
                </td>
                <td className="whitespace-nowrap px-3 py-2 text-right">
                  {formatNumber(r.amount, r.amount % 1 === 0 ? 0 : 2)} {AMOUNT_UNIT_WORDS[r.amountUnit] ?? r.amountUnit}
                </td>
                <td className="px-3 py-2">
                  {r.applicatorName}
                  <span className="block text-xs text-slate">{r.applicatorCertNo ? `cert. ${r.applicatorCertNo}` : 'no certification number'}</span>
                </td>
                <td className="whitespace-nowrap px-3 py-2">
                  Wind {r.windDirection === 'calm' ? 'calm' : `${formatNumber(r.windMph)} mph from ${r.windDirection}`}
                  <span className="block text-xs text-slate">{formatNumber(r.airTempF)} °F</span>
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
