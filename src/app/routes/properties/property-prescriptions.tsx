import { useParams, useSearchParams } from 'react-router-dom';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { PageHeader } from '../../../components/ui/page-header';
import { parseId } from '../../../lib/route-params';
import { formatQuantity } from '../../../lib/quantity-format';
import { useProperty, usePropertyUnits } from '../../../features/prescriptions/api/get-property-plan';
import { usePropertyPrescriptions } from '../../../features/prescriptions/api/get-property-prescriptions';
import { PrescriptionPanel } from '../../../features/prescriptions/components/prescription-panel';
import type { PrescriptionDto } from '../../../features/prescriptions/lib/types';
import { formatDollars } from '../../../../shared/domain/prescription-summary';
import { KIND_STYLES, UNIT_KINDS } from '../../../../shared/domain/unit-kinds';
import { REGION_LABELS, REGIONS, type Region } from '../../../../shared/domain/planting-windows';
import type { UnitDto } from '../../../../shared/schemas/unit';

function measureText(u: UnitDto): string {
  if (u.acres !== null) return `${formatQuantity(u.acres, u.acres < 1 ? 2 : 1)} ac`;
  if (u.lengthFt !== null) return `${formatQuantity(u.lengthFt, 0)} ft`;
  return '';
}

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <div className="rounded-md border border-rule bg-card px-4 py-3">
      <p className="text-xs uppercase tracking-wide text-slate">{label}</p>
      <p className="figure text-2xl font-bold text-ink">{value}</p>
    </div>
  );
}

function UnitRow({ unit, prescriptions, selected, onSelect }: { unit: UnitDto; prescriptions: PrescriptionDto[]; selected: boolean; onSelect: () => void }) {
  const total = prescriptions.reduce((sum, p) => sum + p.totalCents, 0);
  const attention = prescriptions.some((p) => p.warnings.some((w) => w.severity === 'warning'));
  return (
    <li>
      <button
        type="button"
        onClick={onSelect}
        aria-current={selected ? 'true' : undefined}
        className={`flex w-full items-start justify-between gap-3 rounded px-3 py-2 text-left text-sm ${selected ? 'bg-moss/10 ring-1 ring-moss/40' : 'hover:bg-paper'}`}
      >
        <span className="min-w-0">
          <span className="block font-semibold text-ink">{unit.name}</span>
          {prescriptions.length === 0 ? (
            <span className="block text-xs text-slate">No prescription yet</span>
          ) : (
            prescriptions.map((p) => (
              <span key={p.id} className="block text-xs text-slate">
                {p.practiceName} · {p.year}
              </span>
            ))
          )}
          {attention ? <span className="block text-xs font-semibold text-[#A04A25]">Schedule needs attention</span> : null}
        </span>
        <span className="shrink-0 text-right">
          <span className="block tabular-nums text-slate">{measureText(unit)}</span>
          {prescriptions.length ? <span className="figure block font-bold">{formatDollars(total)}</span> : null}
        </span>
      </button>
    </li>
  );
}

/** A property's units grouped by kind, each with its prescriptions; the selected unit's prescription panel beside them; the property's total. */
export function PropertyPrescriptionsPage() {
  const propertyId = parseId(useParams().id) ?? 0;
  const [params, setParams] = useSearchParams();
  const property = useProperty(propertyId);
  const units = usePropertyUnits(propertyId);
  const prescriptions = usePropertyPrescriptions(propertyId);

  if (propertyId === 0) return <ErrorPanel error={new Error('This address names no property. Open the property from the Desk or the clients list.')} />;
  if (property.isPending || units.isPending || prescriptions.isPending) return <Loading />;
  if (property.isError) return <ErrorPanel error={property.error} />;
  if (units.isError) return <ErrorPanel error={units.error} />;
  if (prescriptions.isError) return <ErrorPanel error={prescriptions.error} />;

  const p = property.data;
  const byUnit = new Map<number, PrescriptionDto[]>();
  for (const rx of prescriptions.data) byUnit.set(rx.unitId, [...(byUnit.get(rx.unitId) ?? []), rx]);
  const total = prescriptions.data.reduce((sum, rx) => sum + rx.totalCents, 0);
  const selectedId = parseId(params.get('unit') ?? undefined);
  const selected = units.data.find((u) => u.id === selectedId) ?? null;
  const groups = UNIT_KINDS.map((kind) => ({ kind, units: units.data.filter((u) => u.kind === kind) })).filter((g) => g.units.length > 0);
  const region = p.region && (REGIONS as readonly string[]).includes(p.region) ? (p.region as Region) : null;
  const select = (id: number) =>
    setParams(
      (prev) => {
        const next = new URLSearchParams(prev);
        next.set('unit', String(id));
        return next;
      },
      { replace: true },
    );

  return (
    <div className="flex flex-col gap-5">
      <PageHeader title={`Prescriptions — ${p.name}`}>
        {[p.clientName, p.acres !== null ? `${formatQuantity(p.acres, 1)} acres` : null, region ? REGION_LABELS[region] : null].filter(Boolean).join(' · ')}
      </PageHeader>
      <div className="grid grid-cols-2 gap-3 lg:grid-cols-4">
        <Figure label="Property total" value={formatDollars(total)} />
        <Figure label="Prescriptions" value={String(prescriptions.data.length)} />
        <Figure label="Units with one" value={`${units.data.filter((u) => byUnit.has(u.id)).length} of ${units.data.length}`} />
      </div>
      {units.data.length === 0 ? (
        <EmptyState title="No units drawn on this property yet">Draw food plots, cover and other units on the plan map first; then write their prescriptions here.</EmptyState>
      ) : (
        <div className="grid items-start gap-5 lg:grid-cols-[minmax(0,1fr)_minmax(360px,420px)]">
          <div className="flex flex-col gap-4">
            {groups.map((g) => {
              const style = KIND_STYLES[g.kind];
              const groupTotal = g.units.reduce((sum, u) => sum + (byUnit.get(u.id) ?? []).reduce((s, rx) => s + rx.totalCents, 0), 0);
              const headingId = `kind-${g.kind}`;
              return (
                <section key={g.kind} aria-labelledby={headingId} className="rounded-md border border-rule bg-card p-3">
                  <header className="mb-1 flex items-baseline justify-between gap-3 px-1">
                    <h2 id={headingId} className="flex items-center gap-2 text-base font-bold">
                      <span aria-hidden className="inline-block size-3 rounded-sm border" style={{ backgroundColor: style.fill, borderColor: style.stroke }} />
                      {style.label}
                      <span className="font-sans text-sm font-normal text-slate">({g.units.length})</span>
                    </h2>
                    {groupTotal > 0 ? <span className="figure text-sm text-slate">{formatDollars(groupTotal)}</span> : null}
                  </header>
                  <ul className="flex flex-col gap-1">
                    {g.units.map((u) => (
                      <UnitRow key={u.id} unit={u} prescriptions={byUnit.get(u.id) ?? []} selected={selected?.id === u.id} onSelect={() => select(u.id)} />
                    ))}
                  </ul>
                </section>
              );
            })}
          </div>
          <aside aria-label="Prescription" className="lg:sticky lg:top-4 lg:max-h-[calc(100vh-2rem)] lg:overflow-y-auto">
            {selected ? (
              <Card>
                <PrescriptionPanel unit={selected} region={p.region} />
              </Card>
            ) : (
              <EmptyState title="Choose a unit">Its prescriptions show here, and you can write a new one from the practice library.</EmptyState>
            )}
          </aside>
        </div>
      )}
    </div>
  );
}
