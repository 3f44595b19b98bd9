import { useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { CautionBox, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { PageHeader } from '../../../components/ui/page-header';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { buttonClasses } from '../../../components/ui/button';
import { SprayRecordsTable } from '../../../features/spray-records/components/spray-records-table';
import { sprayRecordsUrl, useSprayRecords } from '../../../features/spray-records/api/get-spray-records';
import { useProperty } from '../../../lib/resources/property';
import { firmToday } from '../../../lib/firm-clock';
import { parseId } from '../../../lib/route-params';
import type { SprayRecordDto } from '../../../../shared/schemas/spray-records';

/** Seasons offered: this year and the years records must still be kept (two years, 7 CFR 110.5) and a little more. */
const SEASONS_BACK = 4;

const matches = (r: SprayRecordDto, words: string) => {
  if (!words) return true;
  const hay = `${r.productName} ${r.epaRegNo ?? ''} ${r.unitName} ${r.applicatorName} ${r.cropOrSite}`.toLowerCase();
  return words
    .toLowerCase()
    .split(/\s+/)
    .every((w) => hay.includes(w));
};

/**
 * The firm's spray records: a season at a time, for every property or one, filtered by product, unit or
 * applicator and to restricted-use products; CSV and PDF exports of the same season and property.
 * The filters live in the address (`season`, `propertyId`, `q`, `rup`, and `task` marking one task's rows).
 */
export function SprayRecordsPage() {
  const [params, setParams] = useSearchParams();
  const thisYear = Number(firmToday().slice(0, 4));
  const season = Number(params.get('season')) || thisYear;
  const propertyId = parseId(params.get('propertyId') ?? undefined) ?? undefined;
  const taskId = parseId(params.get('task') ?? undefined);
  const words = params.get('q') ?? '';
  const restrictedOnly = params.get('rup') === '1';
  const filter = { season, propertyId };
  const records = useSprayRecords(filter);
  // Every property with records this season, for the property filter (one query, cached).
  const allProperties = useSprayRecords({ season });
  const chosen = useProperty(propertyId ?? 0);

  const set = (key: string, value: string | null) =>
    setParams(
      (p) => {
        const next = new URLSearchParams(p);
        if (value) next.set(key, value);
        else next.delete(key);
        return next;
      },
      { replace: true },
    );

  const propertyOptions = useMemo(() => {
    const byId = new Map<number, string>();
    for (const r of allProperties.data?.records ?? []) if (r.propertyId) byId.set(r.propertyId, r.propertyName);
    if (propertyId && chosen.data) byId.set(propertyId, chosen.data.name);
    return [...byId.entries()].sort((a, b) => a[1].localeCompare(b[1]));
  }, [allProperties.data, propertyId, chosen.data]);

  const shown = (records.data?.records ?? []).filter((r) => matches(r, words) && (!restrictedOnly || r.restrictedUse));
  const years = Array.from({ length: SEASONS_BACK + 1 }, (_, i) => thisYear - i);
  if (!years.includes(season)) years.push(season);

  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title="Spray records"
        actions={
          <>
            <a href={sprayRecordsUrl(filter, 'csv')} className={buttonClasses('secondary')} download>
              CSV
            </a>
            <a href={sprayRecordsUrl(filter, 'pdf')} className={buttonClasses('secondary')} target="_blank" rel="noreferrer">
              PDF to print
            </a>
          </>
        }
      >
        Each herbicide application the crew recorded: what USDA’s pesticide recordkeeping (7 CFR Part 110) asks, with wind and temperature.
      </PageHeader>

      <form className="grid gap-3 rounded-md border border-rule bg-card p-3 sm:grid-cols-2 lg:grid-cols-4 print:hidden" role="search" aria-label="Filter spray records" onSubmit={(e) => e.preventDefault()}>
        <SelectField label="Season" value={String(season)} onChange={(e) => set('season', e.target.value === String(thisYear) ? null : e.target.value)}>
          {years.map((y) => (
            <option key={y} value={y}>
              {y}
            </option>
          ))}
        </SelectField>
        <SelectField label="Property" value={propertyId ? String(propertyId) : ''} onChange={(e) => set('propertyId', e.target.value || null)}>
          <option value="">All properties</option>
          {propertyOptions.map(([id, name]) => (
            <option key={id} value={id}>
              {name}
            </option>
          ))}
        </SelectField>
        <TextField label="Product, unit or applicator" type="search" defaultValue={words} onChange={(e) => set('q', e.target.value.trim() || null)} />
        <label className="flex items-center gap-2 self-end pb-2 text-sm">
          <input type="checkbox" className="size-4 accent-clay" checked={restrictedOnly} onChange={(e) => set('rup', e.target.checked ? '1' : null)} /> Restricted-use products only
        </label>
      </form>

      <CautionBox title="Herbicides: the label is the law">
        <p>{records.data?.caution ?? 'Apply every product only as its label directs. Keep these records at least two years (7 CFR 110.5).'}</p>
        <p className="mt-1">
          Restricted-use products are applied only by or under a certified applicator. Mind drift near water, neighbours’ crops and homes; state rules and your licence may ask for more
          than this record holds — follow them and local licensed practice.
        </p>
      </CautionBox>

      {records.isPending ? (
        <Loading label="Loading spray records…" />
      ) : records.isError ? (
        <ErrorPanel error={records.error} onRetry={() => void records.refetch()} />
      ) : records.data.records.length === 0 ? (
        <EmptyState title={`No spray records in ${season}${chosen.data && propertyId ? ` on ${chosen.data.name}` : ''}`}>
          A record is made when the crew marks a herbicide step done on the field sheet. Try another season or all properties.
        </EmptyState>
      ) : (
        <>
          <p className="text-sm text-slate" aria-live="polite">
            {shown.length === records.data.records.length ? `${shown.length} ${shown.length === 1 ? 'application' : 'applications'}` : `Showing ${shown.length} of ${records.data.records.length} applications`} in {season}
            {chosen.data && propertyId ? ` on ${chosen.data.name}` : ''}.
          </p>
          {shown.length ? <SprayRecordsTable records={shown} highlightTaskId={taskId} /> : <EmptyState title="No record matches the filters" />}
        </>
      )}
    </div>
  );
}

/** Route module for React Router's lazy loading. */
export const Component = SprayRecordsPage;
