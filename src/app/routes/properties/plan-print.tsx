import { useEffect, useMemo, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { KIND_STYLES } from '../../../../shared/domain/unit-kinds';
import { bboxOf } from '../../../../shared/domain/geometry';
import { paths } from '../../../config/paths';
import { ErrorPanel, Loading } from '../../../components/ui/card';
import { useProperty } from '../../../features/plan-map/api/get-property';
import { useUnits } from '../../../features/plan-map/api/get-units';
import { usePlan } from '../../../features/plan-map/api/get-plan';
import { LegendList } from '../../../features/plan-map/components/legend-list';
import { KindSwatch } from '../../../features/plan-map/components/kind-swatch';
import { ShareBar } from '../../../features/plan-map/components/share-bar';
import { renderPlanImage, type PlanImage } from '../../../features/plan-map/lib/plan-image';
import { niceScaleBar } from '../../../features/plan-map/lib/scale-bar';
import { groupByKind, kindsPresent, unitsToCollections } from '../../../features/plan-map/lib/unit-features';
import { formatAcresShort, formatFeet, formatHectares, formatMiles, showsImperial } from '../../../features/plan-map/lib/measure-format';
import { firmToday, formatDay } from '../../../lib/firm-clock';

const IMAGE_W = 960;
const IMAGE_H = 640;

function NorthArrow() {
  return (
    <svg width="28" height="40" viewBox="0 0 28 40" role="img" aria-label="North is up">
      <path d="M14 2 L24 30 L14 24 L4 30 Z" fill="#1F2A24" />
      <path d="M14 2 L14 24 L4 30 Z" fill="#FFFDF7" stroke="#1F2A24" strokeWidth="1" />
      <text x="14" y="39" textAnchor="middle" fontSize="9" fontFamily="Merriweather, serif" fill="#1F2A24">
        N
      </text>
    </svg>
  );
}

/** A printable plan: the map in the kind colours with legend, scale bar and north arrow, and the unit table. */
export function PlanPrintPage() {
  const propertyId = Number(useParams().id);
  const property = useProperty(propertyId);
  const units = useUnits(propertyId);
  const plan = usePlan(propertyId);
  const [image, setImage] = useState<PlanImage | null>(null);
  const [imageError, setImageError] = useState<unknown>(null);
  const unitList = useMemo(() => units.data ?? [], [units.data]);
  const boundary = property.data?.boundary ?? null;

  useEffect(() => {
    if (!property.data || !units.data) return;
    const box = bboxOf(boundary ? [boundary] : units.data.map((u) => u.geometry));
    if (!box) return;
    let live = true;
    renderPlanImage({ boundary, collections: unitsToCollections(units.data), box, widthPx: IMAGE_W, heightPx: IMAGE_H })
      .then((img) => live && setImage(img))
      .catch((err) => live && setImageError(err));
    return () => {
      live = false;
    };
  }, [property.data, units.data, boundary]);

  if (property.isError) return <div className="p-6"><ErrorPanel error={property.error} /></div>;
  if (property.isPending || units.isPending) return <Loading />;
  const p = property.data;
  const scale = image ? niceScaleBar(image.metresPerPx, 180) : null;
  const groups = groupByKind(unitList);
  const kinds = kindsPresent(unitList);

  return (
    <div className="mx-auto max-w-[1000px] bg-card px-8 py-6 print:max-w-none print:px-0 print:py-0">
      <style>{'@media print { @page { size: letter landscape; margin: 12mm; } html, body { background: #fff; } }'}</style>
      <nav className="mb-4 flex items-center justify-between print:hidden">
        <Link to={paths.planMap(propertyId)} className="text-sm text-moss-deep hover:underline">
          ← Back to the plan map
        </Link>
        <button type="button" onClick={() => window.print()} className="rounded bg-moss px-4 py-2 text-sm font-semibold text-white hover:bg-moss-deep">
          Print
        </button>
      </nav>
      <header className="mb-4 flex items-end justify-between gap-4 border-b-2 border-ink pb-2">
        <div>
          <p className="text-sm text-slate">{p.clientName}</p>
          <h1 className="text-2xl font-bold">{p.name}</h1>
          <p className="text-sm text-slate">{[p.county ? `${p.county} County` : null, p.state].filter(Boolean).join(', ')}</p>
        </div>
        <div className="text-right">
          {p.acres ? <p className="figure text-xl font-bold">{formatAcresShort(p.acres)}</p> : null}
          <p className="text-xs text-slate">Printed {formatDay(firmToday(), { long: true })}</p>
        </div>
      </header>

      <figure className="relative break-inside-avoid print:mx-auto print:w-fit">
        {image ? (
          <img src={image.dataUrl} alt={`Plan map of ${p.name}`} className="block w-full rounded border border-rule print:h-[4.9in] print:w-auto" />
        ) : imageError ? (
          <ErrorPanel error={imageError} />
        ) : (
          <div className="flex aspect-[3/2] w-full items-center justify-center rounded border border-rule bg-paper text-sm text-slate">Drawing the map…</div>
        )}
        {image && scale ? (
          <>
            <div className="absolute right-3 top-3 rounded bg-card/90 px-1.5 py-1">
              <NorthArrow />
            </div>
            <div className="absolute bottom-3 left-3 box-content rounded bg-card/90 px-2 pb-0.5 pt-1.5 text-xs" style={{ width: `${(scale.px / IMAGE_W) * 100}%` }} aria-label={`Scale bar ${scale.label}`}>
              <div className="flex h-1.5 w-full border border-ink">
                <div className="h-full w-1/2 bg-ink" />
                <div className="h-full w-1/2 bg-card" />
              </div>
              <div className="flex justify-between font-serif">
                <span>0</span>
                <span>{scale.label}</span>
              </div>
            </div>
          </>
        ) : null}
      </figure>

      <div className="mt-4 grid break-inside-avoid grid-cols-3 gap-6">
        <section aria-label="Legend">
          <h2 className="mb-1 text-base font-bold">Legend</h2>
          <LegendList kinds={kinds} hasBoundary={!!boundary} className="text-sm" />
        </section>
        <section aria-label="Acres by kind" className="col-span-2">
          <h2 className="mb-1 text-base font-bold">Acres by kind</h2>
          {plan.data ? <ShareBar rows={plan.data.shareByKind} boundaryAcres={plan.data.boundaryAcres} /> : null}
        </section>
      </div>

      <section className="mt-6 break-before-auto">
        <h2 className="mb-2 text-base font-bold">Units</h2>
        <table className="w-full text-sm">
          <thead>
            <tr className="border-b border-ink text-left text-xs uppercase tracking-wide text-slate">
              <th className="py-1 font-semibold">Unit</th>
              <th className="py-1 font-semibold">Kind</th>
              <th className="py-1 text-right font-semibold">Size</th>
              <th className="py-1 pl-4 font-semibold">Notes</th>
            </tr>
          </thead>
          <tbody>
            {groups.flatMap((g) =>
              g.units.map((u) => (
                <tr key={u.id} className="break-inside-avoid border-b border-rule/70">
                  <td className="py-1 font-semibold">{u.name}</td>
                  <td className="py-1">
                    <span className="inline-flex items-center gap-1.5">
                      <KindSwatch kind={u.kind} size={12} />
                      {KIND_STYLES[u.kind].label}
                    </span>
                  </td>
                  <td className="py-1 text-right tabular-nums">
                    {u.acres !== null ? `${formatAcresShort(u.acres)}${showsImperial() ? ` · ${formatHectares(u.hectares ?? 0)}` : ''}` : u.lengthFt !== null ? `${formatFeet(u.lengthFt)}${showsImperial() ? ` · ${formatMiles(u.lengthMi ?? 0)}` : ''}` : '—'}
                  </td>
                  <td className="py-1 pl-4 text-slate">{u.notes ?? ''}</td>
                </tr>
              )),
            )}
          </tbody>
        </table>
        {unitList.length === 0 ? <p className="py-2 text-sm text-slate">No units are drawn on this property yet.</p> : null}
      </section>
    </div>
  );
}

/** Route module for React Router's lazy loading. */
export const Component = PlanPrintPage;
