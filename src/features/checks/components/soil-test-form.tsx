import { useState } from 'react';
import { get, useForm, type FieldErrors } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { useToast } from '../../../components/ui/toast';
import { fieldProblems, sentence } from '../../../lib/api-errors';
import { firmToday, formatDay } from '../../../lib/firm-clock';
import { DomainValidationError } from '../../../../shared/domain/errors';
import { recommendSoilTest, retestDue, SOIL_LAB_METHOD_LABELS, SOIL_LAB_METHODS } from '../../../../shared/domain/soil-tests';
import { SoilTestCreateSchema, type SoilTestContextDto } from '../../../../shared/schemas/soil-tests';
import { useCreateSoilTest, useSoilTestContext } from '../api/soil-tests';

type FormIn = z.input<typeof SoilTestCreateSchema>;
type FormOut = z.output<typeof SoilTestCreateSchema>;

const FIELDS = ['sampledOn', 'lab', 'ph', 'bufferPh', 'bufferMethod', 'labMethod', 'pPpm', 'kPpm', 'organicMatterPct', 'cec', 'enmLbPerAcre'] as const;

/** A number box: empty → null (left out), text → NaN for the schema to refuse with its sentence. */
const optionalNumber = { setValueAs: (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(String(v).replace(/,/g, ''))) };
const requiredNumber = { setValueAs: (v: unknown) => (v === '' || v === null || v === undefined ? undefined : Number(String(v).replace(/,/g, ''))) };

const errorOf = (errors: FieldErrors<FormIn>, name: string): string | undefined => {
  const message = (get(errors, name) as { message?: string } | undefined)?.message;
  return message ? sentence(message) : undefined;
};

type Unit = SoilTestContextDto['units'][number];

/** The recommendation the fields make, worked in the browser by the same shared function the server stores with. */
export function soilTestPreview(values: unknown, context: SoilTestContextDto, unit: Unit): { ok: true; lime: string; working: string; nutrients: string; nutrientsWorking: string; retest: string; source: string } | { ok: false; message: string } {
  const parsed = SoilTestCreateSchema.safeParse(values);
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    return { ok: false, message: sentence(issue.message) };
  }
  try {
    const r = recommendSoilTest({ ...parsed.data, bufferMethod: parsed.data.bufferMethod ?? null }, { method: context.method, cropGroup: unit.cropGroup, limeEnmLbPerTon: unit.limeEnmLbPerTon });
    return {
      ok: true,
      lime: r.lime.tonsPerAcre > 0 ? `Lime ${r.lime.tonsPerAcre} t/acre to pH ${r.lime.targetPh}` : `No lime: pH ${parsed.data.ph} meets the target ${r.lime.targetPh}`,
      working: r.lime.working,
      nutrients: `P2O5 ${r.nutrients.p2o5LbPerAcre} lb/acre, K2O ${r.nutrients.k2oLbPerAcre} lb/acre`,
      nutrientsWorking: r.nutrients.working,
      retest: formatDay(retestDue(parsed.data.sampledOn, context.retestYears)),
      source: `Lime by ${r.lime.source}. P and K ${r.nutrients.source}.`,
    };
  } catch (error) {
    if (error instanceof DomainValidationError) return { ok: false, message: `${error.field}: ${error.message}` };
    throw error;
  }
}

/** A lab result typed in for one unit, with the lime and P and K it recommends shown as the numbers go in; a fresh form after each save (date and lab kept). */
export function SoilTestForm({ propertyId, unitId }: { propertyId: number; unitId: number }) {
  const [kept, setKept] = useState<{ n: number; sampledOn: string; lab: string }>({ n: 0, sampledOn: firmToday(), lab: '' });
  return <SoilTestFields key={kept.n} propertyId={propertyId} unitId={unitId} sampledOn={kept.sampledOn} lab={kept.lab} onSaved={(v) => setKept((k) => ({ n: k.n + 1, ...v }))} />;
}

function SoilTestFields({ propertyId, unitId, sampledOn, lab, onSaved }: { propertyId: number; unitId: number; sampledOn: string; lab: string; onSaved: (kept: { sampledOn: string; lab: string }) => void }) {
  const context = useSoilTestContext(propertyId);
  const create = useCreateSoilTest();
  const toast = useToast();
  const form = useForm<FormIn, unknown, FormOut>({ resolver: zodResolver(SoilTestCreateSchema), defaultValues: { sampledOn, lab, bufferMethod: null, labMethod: 'bray-nh4oac' } });
  const e = form.formState.errors;
  const values = form.watch();
  const ctx = context.data;
  const unit = ctx?.units.find((u) => u.unitId === unitId);
  const preview = ctx && unit ? soilTestPreview(values, ctx, unit) : null;

  const submit = form.handleSubmit(async (input) => {
    try {
      await create.mutateAsync({ unitId, input });
      toast('success', 'Soil test saved with its recommendation.');
      onSaved({ sampledOn: input.sampledOn, lab: input.lab });
    } catch (error) {
      let placed = false;
      for (const p of fieldProblems(error)) {
        const field = FIELDS.find((f) => p.path === f || p.path.endsWith(`.${f}`));
        if (field) {
          form.setError(field, { type: 'server', message: p.message });
          placed = true;
        }
      }
      if (!placed) form.setError('root.server', { type: 'server', message: error instanceof Error ? error.message : 'Not saved. Try again.' });
    }
  });

  return (
    <Card title="Enter a soil test">
      <form className="grid grid-cols-2 gap-3" onSubmit={(ev) => void submit(ev)} noValidate aria-label="Enter a soil test">
        <TextField label="Sampled on" type="date" error={errorOf(e, 'sampledOn')} {...form.register('sampledOn')} />
        <TextField label="Laboratory" error={errorOf(e, 'lab')} {...form.register('lab')} />
        <TextField label="Soil pH" inputMode="decimal" error={errorOf(e, 'ph')} {...form.register('ph', requiredNumber)} />
        <SelectField label="Buffer method" error={errorOf(e, 'bufferMethod')} {...form.register('bufferMethod', { setValueAs: (v: string) => (v ? v : null) })}>
          <option value="">None on the report</option>
          {(ctx?.buffers ?? []).map((b) => (
            <option key={b} value={b}>
              {b[0]!.toUpperCase() + b.slice(1)}
            </option>
          ))}
        </SelectField>
        <TextField label="Buffer pH" inputMode="decimal" hint={ctx?.method === 'ncdacs' ? 'Needed below the target pH' : 'Optional'} error={errorOf(e, 'bufferPh')} {...form.register('bufferPh', optionalNumber)} />
        <TextField label="ENM, lb/acre" inputMode="decimal" hint={ctx?.method === 'missouri' ? 'The lab’s ENM recommendation' : 'Optional'} error={errorOf(e, 'enmLbPerAcre')} {...form.register('enmLbPerAcre', optionalNumber)} />
        <SelectField label="P and K method" hint="Mehlich-3 is converted to Bray P1 and ammonium-acetate K before the Tri-State rules (Ohio State ANR-75)" error={errorOf(e, 'labMethod')} {...form.register('labMethod')}>
          {SOIL_LAB_METHODS.map((m) => (
            <option key={m} value={m}>
              {SOIL_LAB_METHOD_LABELS[m]}
            </option>
          ))}
        </SelectField>
        <TextField label="P, ppm" inputMode="decimal" hint="Optional" error={errorOf(e, 'pPpm')} {...form.register('pPpm', optionalNumber)} />
        <TextField label="K, ppm" inputMode="decimal" hint="Optional" error={errorOf(e, 'kPpm')} {...form.register('kPpm', optionalNumber)} />
        <TextField label="Organic matter, %" inputMode="decimal" hint="Optional" error={errorOf(e, 'organicMatterPct')} {...form.register('organicMatterPct', optionalNumber)} />
        <TextField label="CEC, meq/100 g" inputMode="decimal" hint="Optional" error={errorOf(e, 'cec')} {...form.register('cec', optionalNumber)} />
        <div className="col-span-2 rounded border border-rule bg-paper p-3 text-sm" aria-live="polite" data-testid="soil-test-preview">
          {!ctx || !unit ? (
            <p className="text-slate">{context.isError ? 'The recommendation preview could not be loaded; the server still works it out when you save.' : 'Loading the firm’s method…'}</p>
          ) : preview?.ok ? (
            <>
              <p className="font-serif font-bold text-ink">{preview.lime}</p>
              <p className="text-ink">{preview.nutrients}</p>
              <p className="mt-1 text-xs text-slate">
                {preview.working}. {preview.nutrientsWorking}. {preview.source} Retest due {preview.retest}.
              </p>
            </>
          ) : (
            <p className="text-slate">
              By the {ctx.methodLabel}, to the target pH {unit.targetPh} of this {unit.cropGroup} unit. {preview?.message}
            </p>
          )}
        </div>
        {e.root?.server?.message ? <p className="col-span-2 text-sm text-clay">{e.root.server.message}</p> : null}
        <div className="col-span-2">
          <Button type="submit" busy={create.isPending}>
            Save the soil test
          </Button>
        </div>
      </form>
    </Card>
  );
}
