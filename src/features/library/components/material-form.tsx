import type { ReactNode } from 'react';
import { get, useForm, type FieldErrors, type FieldValues, type Path, type UseFormReturn } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { Button } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/select-field';
import { TextField } from '../../../components/ui/text-field';
import { useToast } from '../../../components/ui/toast';
import { fieldProblems, matchField, sentence } from '../../../lib/api-errors';
import type { MaterialCreateInput, MaterialDto, MaterialKind } from '../../../../shared/schemas/library';
import { plsPercent } from '../../../../shared/domain/seeding';
import { useCreateMaterial } from '../api/create-material';
import { useUpdateMaterial } from '../api/update-material';
import {
  FertilizerFormSchema,
  HerbicideFormSchema,
  LimeFormSchema,
  MATERIAL_FORM_FIELDS,
  OtherFormSchema,
  SeedFormSchema,
  materialFormDefaults,
  numberOrUndefined,
} from '../lib/material-forms';

export const MATERIAL_KIND_LABELS: Record<MaterialKind, string> = {
  seed: 'Seed',
  lime: 'Lime',
  fertilizer: 'Fertilizer',
  herbicide: 'Herbicides and adjuvants',
  other: 'Other items',
};

interface KindFormProps {
  material?: MaterialDto;
  onDone: () => void;
}

const errorOf = (errors: FieldErrors, name: string): string | undefined => {
  const message = (get(errors, name) as { message?: string } | undefined)?.message;
  return message ? sentence(message) : undefined;
};

/** Saves through the API and puts a 422's `details[].path` messages beside their fields. */
function useSave<T extends FieldValues>(kind: MaterialKind, form: UseFormReturn<T, unknown, MaterialCreateInput>, { material, onDone }: KindFormProps) {
  const create = useCreateMaterial();
  const update = useUpdateMaterial();
  const toast = useToast();
  const onError = (error: Error) => {
    let placed = false;
    for (const problem of fieldProblems(error)) {
      const field = matchField(problem.path, MATERIAL_FORM_FIELDS[kind]);
      if (field) {
        form.setError(field as Path<T>, { type: 'server', message: problem.message });
        placed = true;
      }
    }
    if (!placed) form.setError('root.server' as Path<T>, { type: 'server', message: error.message });
    toast('error', placed ? 'Not saved: correct the marked fields.' : error.message);
  };
  const submit = form.handleSubmit((input) => {
    if (material) {
      update.mutate({ id: material.id, input }, { onSuccess: (saved) => (toast('success', `${saved.name} saved.`), onDone()), onError });
    } else {
      create.mutate(input, { onSuccess: (saved) => (toast('success', `${saved.name} added to the library.`), onDone()), onError });
    }
  });
  return { submit, busy: create.isPending || update.isPending };
}

function FormShell({ label, submit, busy, editing, rootError, onCancel, children }: { label: string; submit: () => void; busy: boolean; editing: boolean; rootError?: string; onCancel: () => void; children: ReactNode }) {
  return (
    <form
      aria-label={label}
      noValidate
      onSubmit={(e) => {
        e.preventDefault();
        submit();
      }}
      className="flex flex-col gap-3"
    >
      <div className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">{children}</div>
      {rootError ? (
        <p role="alert" className="rounded border-l-4 border-clay bg-clay/10 px-3 py-2 text-sm">
          {rootError}
        </p>
      ) : null}
      <div className="flex gap-2">
        <Button type="submit" busy={busy}>
          {editing ? 'Save material' : 'Add material'}
        </Button>
        <Button type="button" variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

const num = { setValueAs: numberOrUndefined };

function SeedForm(props: KindFormProps) {
  const form = useForm<z.input<typeof SeedFormSchema>, unknown, z.output<typeof SeedFormSchema>>({ resolver: zodResolver(SeedFormSchema), defaultValues: materialFormDefaults('seed', props.material) });
  const { submit, busy } = useSave('seed', form, props);
  const e = form.formState.errors;
  const [purity, germination, dormant] = form.watch(['purityPct', 'germinationPct', 'dormantPct']);
  let pls: string | undefined;
  try {
    if (typeof purity === 'number' && typeof germination === 'number') pls = `PLS ${plsPercent({ purityPct: purity, germinationPct: germination, dormantPct: typeof dormant === 'number' ? dormant : undefined }).toFixed(1)} %`;
  } catch {
    pls = undefined;
  }
  return (
    <FormShell label={props.material ? `Edit ${props.material.name}` : 'New seed'} submit={submit} busy={busy} editing={Boolean(props.material)} rootError={e.root?.server?.message} onCancel={props.onDone}>
      <TextField label="Name" error={errorOf(e, 'name')} {...form.register('name')} />
      <TextField label="Species" hint="Common name, used in summaries" error={errorOf(e, 'species')} {...form.register('species')} />
      <TextField label="Purity, %" inputMode="decimal" error={errorOf(e, 'purityPct')} {...form.register('purityPct', num)} />
      <TextField label="Germination, %" inputMode="decimal" error={errorOf(e, 'germinationPct')} hint={pls} {...form.register('germinationPct', num)} />
      <TextField label="Dormant seed, %" inputMode="decimal" hint="Optional (hard seed)" error={errorOf(e, 'dormantPct')} {...form.register('dormantPct', num)} />
      <TextField label="Usual rate, lb/acre" inputMode="decimal" hint="Optional, pure stand" error={errorOf(e, 'rateLbPerAcre')} {...form.register('rateLbPerAcre', num)} />
      <TextField label="Package size, lb" inputMode="decimal" error={errorOf(e, 'packageSizeLb')} {...form.register('packageSizeLb', num)} />
      <TextField label="Package price, $" inputMode="decimal" error={errorOf(e, 'packagePriceCents')} {...form.register('packagePriceCents')} />
    </FormShell>
  );
}

function LimeForm(props: KindFormProps) {
  const form = useForm<z.input<typeof LimeFormSchema>, unknown, z.output<typeof LimeFormSchema>>({ resolver: zodResolver(LimeFormSchema), defaultValues: materialFormDefaults('lime', props.material) });
  const { submit, busy } = useSave('lime', form, props);
  const e = form.formState.errors;
  const basis = form.watch('pricing.basis');
  return (
    <FormShell label={props.material ? `Edit ${props.material.name}` : 'New lime'} submit={submit} busy={busy} editing={Boolean(props.material)} rootError={e.root?.server?.message} onCancel={props.onDone}>
      <TextField label="Name" error={errorOf(e, 'name')} {...form.register('name')} />
      <TextField label="ENM, lb/ton" inputMode="decimal" hint="Optional, from the label" error={errorOf(e, 'enmLbPerTon')} {...form.register('enmLbPerTon', num)} />
      <SelectField label="Sold" error={errorOf(e, 'pricing.basis')} {...form.register('pricing.basis')}>
        <option value="per-ton">By the ton</option>
        <option value="bag">In bags</option>
      </SelectField>
      {basis === 'bag' ? (
        <>
          <TextField label="Bag size, lb" inputMode="decimal" error={errorOf(e, 'pricing.bagSizeLb')} {...form.register('pricing.bagSizeLb', num)} />
          <TextField label="Bag price, $" inputMode="decimal" error={errorOf(e, 'pricing.bagPriceCents')} {...form.register('pricing.bagPriceCents')} />
        </>
      ) : (
        <TextField label="Price per ton, $" inputMode="decimal" error={errorOf(e, 'pricing.pricePerTonCents')} {...form.register('pricing.pricePerTonCents')} />
      )}
    </FormShell>
  );
}

function FertilizerForm(props: KindFormProps) {
  const form = useForm<z.input<typeof FertilizerFormSchema>, unknown, z.output<typeof FertilizerFormSchema>>({ resolver: zodResolver(FertilizerFormSchema), defaultValues: materialFormDefaults('fertilizer', props.material) });
  const { submit, busy } = useSave('fertilizer', form, props);
  const e = form.formState.errors;
  return (
    <FormShell label={props.material ? `Edit ${props.material.name}` : 'New fertilizer'} submit={submit} busy={busy} editing={Boolean(props.material)} rootError={e.root?.server?.message} onCancel={props.onDone}>
      <TextField label="Name" error={errorOf(e, 'name')} {...form.register('name')} />
      <TextField label="Grade, N-P-K" placeholder="13-13-13" error={errorOf(e, 'grade')} {...form.register('grade')} />
      <TextField label="Bag size, lb" inputMode="decimal" error={errorOf(e, 'bagSizeLb')} {...form.register('bagSizeLb', num)} />
      <TextField label="Bag price, $" inputMode="decimal" error={errorOf(e, 'bagPriceCents')} {...form.register('bagPriceCents')} />
    </FormShell>
  );
}

function HerbicideForm(props: KindFormProps) {
  const form = useForm<z.input<typeof HerbicideFormSchema>, unknown, z.output<typeof HerbicideFormSchema>>({ resolver: zodResolver(HerbicideFormSchema), defaultValues: materialFormDefaults('herbicide', props.material) });
  const { submit, busy } = useSave('herbicide', form, props);
  const e = form.formState.errors;
  const basis = form.watch('pricing.basis');
  return (
    <FormShell label={props.material ? `Edit ${props.material.name}` : 'New herbicide or adjuvant'} submit={submit} busy={busy} editing={Boolean(props.material)} rootError={e.root?.server?.message} onCancel={props.onDone}>
      <TextField label="Name" error={errorOf(e, 'name')} {...form.register('name')} />
      <TextField label="Active ingredient" hint="Generic name and concentration" error={errorOf(e, 'activeIngredient')} className="lg:col-span-2" {...form.register('activeIngredient')} />
      <TextField label="Concentration, lb a.i./gal" inputMode="decimal" hint="Optional, from the label" error={errorOf(e, 'lbAiPerGal')} {...form.register('lbAiPerGal', num)} />
      <TextField label="Usual rate, lb a.i./acre" inputMode="decimal" hint="Optional" error={errorOf(e, 'rateLbAiPerAcre')} {...form.register('rateLbAiPerAcre', num)} />
      <TextField label="Carrier, gal/acre" inputMode="decimal" hint="Optional" error={errorOf(e, 'carrierGpa')} {...form.register('carrierGpa', num)} />
      <TextField label="Plant-back interval, days" inputMode="numeric" hint="Optional, from the label (months × 30)" error={errorOf(e, 'plantBackDays')} {...form.register('plantBackDays', num)} />
      <TextField label="EPA Reg. No." placeholder="524-475" hint="As on the label; printed on spray records, needed for restricted-use products" error={errorOf(e, 'epaRegNo')} {...form.register('epaRegNo', { setValueAs: (v: string) => (typeof v === 'string' && v.trim() ? v : undefined) })} />
      <SelectField label="Sold" error={errorOf(e, 'pricing.basis')} {...form.register('pricing.basis')}>
        <option value="container">In containers</option>
        <option value="per-gal">By the gallon</option>
      </SelectField>
      {basis === 'per-gal' ? (
        <TextField label="Price per gallon, $" inputMode="decimal" error={errorOf(e, 'pricing.pricePerGalCents')} {...form.register('pricing.pricePerGalCents')} />
      ) : (
        <>
          <TextField label="Container size, gal" inputMode="decimal" error={errorOf(e, 'pricing.containerSizeGal')} {...form.register('pricing.containerSizeGal', num)} />
          <TextField label="Container price, $" inputMode="decimal" error={errorOf(e, 'pricing.containerPriceCents')} {...form.register('pricing.containerPriceCents')} />
        </>
      )}
      <label className="flex items-center gap-2 self-end pb-2 text-sm">
        <input type="checkbox" className="size-4 accent-clay" {...form.register('restrictedUse')} /> Restricted-use product
      </label>
      <label className="flex items-center gap-2 self-end pb-2 text-sm">
        <input type="checkbox" className="size-4 accent-moss" {...form.register('adjuvant')} /> Adjuvant (surfactant, not a herbicide)
      </label>
    </FormShell>
  );
}

function OtherForm(props: KindFormProps) {
  const form = useForm<z.input<typeof OtherFormSchema>, unknown, z.output<typeof OtherFormSchema>>({ resolver: zodResolver(OtherFormSchema), defaultValues: materialFormDefaults('other', props.material) });
  const { submit, busy } = useSave('other', form, props);
  const e = form.formState.errors;
  return (
    <FormShell label={props.material ? `Edit ${props.material.name}` : 'New item'} submit={submit} busy={busy} editing={Boolean(props.material)} rootError={e.root?.server?.message} onCancel={props.onDone}>
      <TextField label="Name" error={errorOf(e, 'name')} {...form.register('name')} />
      <TextField label="One item is a" placeholder="seedling" error={errorOf(e, 'itemLabel')} {...form.register('itemLabel')} />
      <TextField label="Items per pack" inputMode="numeric" error={errorOf(e, 'packSize')} {...form.register('packSize', num)} />
      <TextField label="Pack is called" placeholder="bundle of 25" error={errorOf(e, 'packLabel')} {...form.register('packLabel')} />
      <TextField label="Pack price, $" inputMode="decimal" error={errorOf(e, 'packPriceCents')} {...form.register('packPriceCents')} />
    </FormShell>
  );
}

/** The add or edit form of a material of one kind, validated by the kind's branch of MaterialCreateSchema. */
export function MaterialForm({ kind, material, onDone }: { kind: MaterialKind; material?: MaterialDto; onDone: () => void }) {
  switch (kind) {
    case 'seed':
      return <SeedForm material={material} onDone={onDone} />;
    case 'lime':
      return <LimeForm material={material} onDone={onDone} />;
    case 'fertilizer':
      return <FertilizerForm material={material} onDone={onDone} />;
    case 'herbicide':
      return <HerbicideForm material={material} onDone={onDone} />;
    case 'other':
      return <OtherForm material={material} onDone={onDone} />;
  }
}
