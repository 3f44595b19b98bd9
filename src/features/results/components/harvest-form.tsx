import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { AGE_CLASSES, AGE_CLASS_LABELS, HarvestCreateSchema, type HarvestDto } from '../../../../shared/schemas/results';
import { LIMITS } from '../../../../shared/limits';
import { useCreateHarvest } from '../api/create-harvest';
import { TextField } from '../../../components/ui/text-field';
import { SelectField } from '../../../components/ui/select-field';
import { Button } from '../../../components/ui/button';
import { useToast } from '../../../components/ui/toast';
import { applyServerErrors } from './apply-server-errors';
import { formatDay } from '../../../lib/firm-clock';

type Input = z.input<typeof HarvestCreateSchema>;
type Output = z.output<typeof HarvestCreateSchema>;
const FIELDS = ['date', 'sex', 'ageClass', 'dressedWeightLb', 'antlerPoints', 'unitId', 'stand', 'hunter', 'notes'];
const numberOrNull = (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(v));

/** The harvest record form: date, sex, age class, weight, points and where it was taken. */
export function HarvestForm({ propertyId, units, onSaved }: { propertyId: number; units: readonly { id: number; name: string; kind: string }[]; onSaved?: (record: HarvestDto) => void }) {
  const create = useCreateHarvest(propertyId);
  const toast = useToast();
  const form = useForm<Input, unknown, Output>({
    resolver: zodResolver(HarvestCreateSchema),
    defaultValues: { date: '', sex: 'male', ageClass: '2.5', dressedWeightLb: null, antlerPoints: null, unitId: null, stand: '', hunter: '', notes: '' },
  });
  const errors = form.formState.errors;
  const places = units.filter((u) => u.kind === 'stand-site' || u.kind === 'food-plot' || u.kind === 'cover-planting' || u.kind === 'timber' || u.kind === 'bedding-area');
  const submit = form.handleSubmit((values) =>
    create.mutate(
      { propertyId, input: values },
      {
        onSuccess: (record) => {
          toast('success', `Harvest of ${formatDay(record.date)} saved.`);
          form.reset();
          onSaved?.(record);
        },
        onError: (e) => {
          if (!applyServerErrors(e, FIELDS, form.setError)) toast('error', `The harvest was not saved: ${e.message}`);
        },
      },
    ),
  );
  return (
    <form onSubmit={submit} noValidate aria-label="New harvest record" className="grid gap-3 sm:grid-cols-3">
      <TextField label="Date taken" type="date" error={errors.date?.message} {...form.register('date')} />
      <SelectField label="Sex" error={errors.sex?.message} {...form.register('sex')}>
        <option value="male">Male (buck)</option>
        <option value="female">Female (doe)</option>
      </SelectField>
      <SelectField label="Age class" error={errors.ageClass?.message} {...form.register('ageClass')}>
        {AGE_CLASSES.map((a) => (
          <option key={a} value={a}>
            {AGE_CLASS_LABELS[a]}
          </option>
        ))}
      </SelectField>
      <TextField label="Dressed weight (lb)" type="number" inputMode="decimal" min={0} step="0.1" error={errors.dressedWeightLb?.message} {...form.register('dressedWeightLb', { setValueAs: numberOrNull })} />
      <TextField label="Antler points" type="number" inputMode="numeric" min={0} step={1} hint="Bucks only." error={errors.antlerPoints?.message} {...form.register('antlerPoints', { setValueAs: numberOrNull })} />
      <SelectField label="Unit or stand" error={errors.unitId?.message} {...form.register('unitId', { setValueAs: numberOrNull })}>
        <option value="">Not on the map</option>
        {places.map((u) => (
          <option key={u.id} value={u.id}>
            {u.name}
          </option>
        ))}
      </SelectField>
      <TextField label="Stand (if not on the map)" maxLength={LIMITS.nameMax} error={errors.stand?.message} {...form.register('stand')} />
      <TextField label="Hunter" maxLength={LIMITS.nameMax} error={errors.hunter?.message} {...form.register('hunter')} />
      <TextField label="Notes" maxLength={LIMITS.textMax} error={errors.notes?.message} {...form.register('notes')} />
      <div className="sm:col-span-3">
        <Button type="submit" busy={create.isPending}>
          Save harvest
        </Button>
      </div>
    </form>
  );
}
