import { useState } from 'react';
import { TextButton } from '../../../components/ui/text-button';
import { Button } from '../../../components/ui/button';
import { EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { useToast } from '../../../components/ui/toast';
import { formatDollars } from '../../../../shared/domain/prescription-summary';
import { KIND_STYLES } from '../../../../shared/domain/unit-kinds';
import { formatQuantity } from '../../../lib/quantity-format';
import { usePrescriptionLibrary } from '../api/get-library';
import { useUnitPrescriptions } from '../api/get-unit-prescriptions';
import { useDeletePrescription } from '../api/delete-prescription';
import { asRegion } from '../lib/preview';
import type { PanelUnit, PrescriptionDto } from '../lib/types';
import { PrescriptionDetails } from './prescription-details';
import { PrescriptionForm } from './prescription-form';
import { formatDay } from '../../../lib/firm-clock';

/** "3.3 acres", "1,549 ft" or the kind's name for a point. */
function measureText(unit: PanelUnit): string {
  if (unit.acres !== null) return `${formatQuantity(unit.acres, unit.acres < 1 ? 2 : 1)} ${unit.acres === 1 ? 'acre' : 'acres'}`;
  if (unit.lengthFt !== null) return `${formatQuantity(unit.lengthFt, 0)} ft`;
  return 'point';
}

type Mode = { type: 'list' } | { type: 'write' } | { type: 'edit'; id: number };

function SavedPrescription({
  prescription,
  open,
  onToggle,
  onEdit,
  busy,
}: {
  prescription: PrescriptionDto;
  open: boolean;
  onToggle: () => void;
  onEdit: () => void;
  busy: boolean;
}) {
  const remove = useDeletePrescription();
  const toast = useToast();
  const [confirming, setConfirming] = useState(false);
  const headingId = `prescription-${prescription.id}-heading`;
  return (
    <article aria-labelledby={headingId} className="rounded-md border border-rule bg-card">
      <h3 id={headingId} className="m-0 font-sans text-base">
        <button type="button" aria-expanded={open} onClick={onToggle} className="flex w-full items-baseline justify-between gap-3 px-3 py-2 text-left hover:bg-paper">
          <span className="min-w-0">
            <span className="block font-semibold text-ink">{prescription.practiceName}</span>
            <span className="block text-xs text-slate">
              Season {prescription.year}
              {prescription.targetDate ? ` · target ${formatDay(prescription.targetDate)}` : ''}
              {prescription.warnings.some((w) => w.severity === 'warning') ? <span className="ml-1 font-semibold text-[#A04A25]">· needs attention</span> : null}
            </span>
          </span>
          <span className="figure shrink-0 font-bold">{formatDollars(prescription.totalCents)}</span>
        </button>
      </h3>
      {open ? (
        <div className="flex flex-col gap-4 border-t border-rule px-3 py-3">
          <PrescriptionDetails view={prescription} />
          {prescription.notes ? <p className="whitespace-pre-line text-sm text-slate">Notes: {prescription.notes}</p> : null}
          {confirming ? (
            <div role="group" aria-label="Confirm delete" className="flex flex-wrap items-center gap-2 rounded border border-clay/40 bg-clay/5 px-3 py-2 text-sm">
              <span>Delete this prescription?</span>
              <Button
                type="button"
                variant="danger"
                busy={remove.isPending}
                onClick={() =>
                  remove.mutate(prescription.id, {
                    onSuccess: () => toast('success', `${prescription.practiceName} deleted.`),
                    onError: (e) => toast('error', e.message),
                  })
                }
              >
                Yes, delete
              </Button>
              <Button type="button" variant="secondary" onClick={() => setConfirming(false)}>
                Keep it
              </Button>
            </div>
          ) : (
            <div className="flex flex-wrap gap-2">
              <Button type="button" variant="secondary" onClick={onEdit} disabled={busy}>
                Change
              </Button>
              <TextButton tone="clay" onClick={() => setConfirming(true)}>
                Delete
              </TextButton>
            </div>
          )}
        </div>
      ) : null}
    </article>
  );
}

function PanelBody({ unit, region }: { unit: PanelUnit; region?: string | null }) {
  const prescriptions = useUnitPrescriptions(unit.id);
  const library = usePrescriptionLibrary();
  const [mode, setMode] = useState<Mode>({ type: 'list' });
  const [openId, setOpenId] = useState<number | null>(null);

  if (prescriptions.isPending || library.isPending) return <Loading label="Loading prescriptions…" />;
  if (prescriptions.isError) return <ErrorPanel error={prescriptions.error} />;
  if (library.error) return <ErrorPanel error={library.error} />;

  const list = prescriptions.data;
  const resolvedRegion = asRegion(region ?? list[0]?.schedule.region ?? library.firmRegion);
  const shownId = openId ?? (list.length === 1 ? list[0].id : null);
  const editing = mode.type === 'edit' ? list.find((p) => p.id === mode.id) : undefined;
  const total = list.reduce((sum, p) => sum + p.totalCents, 0);
  const done = (saved?: PrescriptionDto) => {
    setMode({ type: 'list' });
    if (saved) setOpenId(saved.id);
  };

  if (mode.type === 'write' || editing) {
    return (
      <div className="flex flex-col gap-3">
        <h3 className="text-base font-bold">{editing ? `Change ${editing.practiceName}` : 'Write prescription'}</h3>
        <PrescriptionForm unit={unit} region={resolvedRegion} library={library} existing={editing} onDone={done} />
      </div>
    );
  }

  return (
    <div className="flex flex-col gap-3">
      {list.length === 0 ? (
        <EmptyState title="No prescription yet">Write one from a practice in your library; the quantities and cost follow from this unit’s measures.</EmptyState>
      ) : (
        <>
          {list.map((p) => (
            <SavedPrescription
              key={p.id}
              prescription={p}
              open={shownId === p.id}
              onToggle={() => setOpenId(shownId === p.id ? -1 : p.id)}
              onEdit={() => setMode({ type: 'edit', id: p.id })}
              busy={false}
            />
          ))}
          {list.length > 1 ? (
            <p className="flex items-baseline justify-between border-t border-rule pt-2 text-sm">
              <span className="font-semibold">All prescriptions on this unit</span>
              <span className="figure font-bold">{formatDollars(total)}</span>
            </p>
          ) : null}
        </>
      )}
      <div>
        <Button type="button" onClick={() => setMode({ type: 'write' })}>
          Write prescription
        </Button>
      </div>
    </div>
  );
}

/**
 * A unit's prescriptions, and writing, changing and deleting them with a live preview; sized for a
 * side ledger of about 360–420 px. `region` places the schedule (the property's, else the firm's).
 */
export function PrescriptionPanel({ unit, region }: { unit: PanelUnit; region?: string | null }) {
  const style = KIND_STYLES[unit.kind];
  return (
    <section aria-label={`Prescriptions for ${unit.name}`} className="flex w-full min-w-0 flex-col gap-3">
      <header className="flex items-start justify-between gap-3">
        <div className="min-w-0">
          <h2 className="break-words text-lg font-bold">{unit.name}</h2>
          <p className="flex items-center gap-2 text-sm text-slate">
            <span aria-hidden className="inline-block size-3 rounded-sm border" style={{ backgroundColor: style.fill, borderColor: style.stroke }} />
            <span>
              {style.label} · <span className="tabular-nums">{measureText(unit)}</span>
            </span>
          </p>
        </div>
      </header>
      <PanelBody key={unit.id} unit={unit} region={region} />
    </section>
  );
}
