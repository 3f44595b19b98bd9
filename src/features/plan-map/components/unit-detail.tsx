import { useEffect, useId } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { UnitUpdateSchema, type UnitDto, type UnitUpdateInput } from '../../../../shared/schemas/unit';
import { KIND_STYLES, UNIT_KINDS } from '../../../../shared/domain/unit-kinds';
import { centroidOf, formatLatLon } from '../../../../shared/domain/geometry';
import { Button } from '../../../components/ui/button';
import { TextField } from '../../../components/ui/text-field';
import { formatAcresShort, formatFeet, formatHectares, formatMiles, showsImperial } from '../lib/measure-format';
import { isEditableGeometry } from '../lib/plan-map-controller';
import { KindSwatch } from './kind-swatch';

type FormIn = z.input<typeof UnitUpdateSchema>;
type FormOut = z.output<typeof UnitUpdateSchema>;

function Figure({ label, value }: { label: string; value: string }) {
  return (
    <div>
      <dt className="text-xs uppercase tracking-wide text-slate">{label}</dt>
      <dd className="figure text-lg font-bold text-ink">{value}</dd>
    </div>
  );
}

/** A unit's detail in the ledger: its measures, and its name, kind and notes to change. */
export function UnitDetail({
  unit,
  saving,
  deleting,
  onSave,
  onDelete,
  onBack,
  onZoom,
}: {
  unit: UnitDto;
  saving: boolean;
  deleting: boolean;
  onSave: (input: UnitUpdateInput) => Promise<unknown>;
  onDelete: () => void;
  onBack: () => void;
  onZoom: () => void;
}) {
  const style = KIND_STYLES[unit.kind];
  const notesId = useId();
  const kindId = useId();
  const form = useForm<FormIn, unknown, FormOut>({
    resolver: zodResolver(UnitUpdateSchema),
    defaultValues: { name: unit.name, kind: unit.kind, notes: unit.notes ?? '' },
  });
  // A change from elsewhere (Undo) shows in the form unless the person is in the middle of editing.
  const { isDirty } = form.formState;
  useEffect(() => {
    if (!isDirty) form.reset({ name: unit.name, kind: unit.kind, notes: unit.notes ?? '' });
    // eslint-disable-next-line react-hooks/exhaustive-deps -- only a change of the saved values should reset
  }, [unit.name, unit.kind, unit.notes]);
  const submit = form.handleSubmit(async (values) => {
    const input: UnitUpdateInput = { name: values.name, kind: values.kind, notes: values.notes ?? null };
    await onSave(input)
      .then(() => form.reset({ name: input.name, kind: input.kind, notes: input.notes ?? '' }))
      .catch(() => undefined);
  });
  const sameFamily = UNIT_KINDS.filter((k) => KIND_STYLES[k].family === style.family);
  const where = style.family === 'point' ? centroidOf(unit.geometry) : null;
  return (
    <section aria-label={`Unit ${unit.name}`} className="flex flex-col gap-4">
      <div className="flex items-center justify-between gap-2">
        <button type="button" onClick={onBack} className="text-sm text-moss-deep hover:underline">
          ← All units
        </button>
        <button type="button" onClick={onZoom} className="text-sm text-moss-deep hover:underline">
          Zoom to it
        </button>
      </div>
      <header className="flex items-center gap-2">
        <KindSwatch kind={unit.kind} size={20} />
        <div>
          <h2 className="text-lg font-bold leading-tight">{unit.name}</h2>
          <p className="text-sm text-slate">{style.label}</p>
        </div>
      </header>
      <dl className="grid grid-cols-2 gap-3 rounded border border-rule bg-paper/60 p-3" aria-label="Measures">
        {style.family === 'area' ? (
          <>
            <Figure label={showsImperial() ? "Acres" : "Hectares"} value={formatAcresShort(unit.acres ?? 0)} />
            {showsImperial() ? <Figure label="Hectares" value={formatHectares(unit.hectares ?? 0)} /> : null}
            <Figure label="Perimeter" value={formatFeet(unit.perimeterFt ?? 0)} />
          </>
        ) : style.family === 'line' ? (
          <>
            <Figure label="Length" value={formatFeet(unit.lengthFt ?? 0)} />
            {showsImperial() ? <Figure label="Miles" value={formatMiles(unit.lengthMi ?? 0)} /> : null}
          </>
        ) : where ? (
          <div className="col-span-2">
            <dt className="text-xs uppercase tracking-wide text-slate">Position</dt>
            <dd className="font-serif text-sm text-ink">{formatLatLon(where.lon, where.lat)}</dd>
          </div>
        ) : null}
      </dl>
      {isEditableGeometry(unit.geometry) ? (
        <p className="text-xs text-slate">Drag a corner to move it, drag a midpoint to add one, right-click a corner to remove it, or drag the shape to move it. Each change is saved.</p>
      ) : (
        <p className="text-xs text-slate">This unit is made of several parts; to change its shape, delete it and draw it again.</p>
      )}
      <form onSubmit={submit} noValidate className="flex flex-col gap-3">
        <TextField label="Name" error={form.formState.errors.name?.message} {...form.register('name')} />
        <div className="flex flex-col gap-1">
          <label htmlFor={kindId} className="text-sm font-semibold text-ink">
            Kind
          </label>
          <select id={kindId} className="rounded border border-rule bg-white px-3 py-2 text-ink focus:border-moss focus:outline-none focus:ring-2 focus:ring-moss/30" {...form.register('kind')}>
            {sameFamily.map((k) => (
              <option key={k} value={k}>
                {KIND_STYLES[k].label}
              </option>
            ))}
          </select>
          {form.formState.errors.kind ? <p className="text-sm text-clay">{form.formState.errors.kind.message}</p> : null}
        </div>
        <div className="flex flex-col gap-1">
          <label htmlFor={notesId} className="text-sm font-semibold text-ink">
            Notes
          </label>
          <textarea
            id={notesId}
            rows={4}
            aria-invalid={form.formState.errors.notes ? true : undefined}
            className="rounded border border-rule bg-white px-3 py-2 text-sm text-ink focus:border-moss focus:outline-none focus:ring-2 focus:ring-moss/30"
            placeholder="Soil, access, what the landowner asked for…"
            {...form.register('notes')}
          />
          {form.formState.errors.notes ? <p className="text-sm text-clay">{form.formState.errors.notes.message}</p> : null}
        </div>
        <div className="flex items-center justify-between gap-2">
          <Button type="submit" busy={saving} disabled={!form.formState.isDirty}>
            Save changes
          </Button>
          <Button type="button" variant="danger" busy={deleting} onClick={onDelete}>
            Delete unit
          </Button>
        </div>
      </form>
    </section>
  );
}
