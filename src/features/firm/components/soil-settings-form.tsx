import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { useFirm, useUpdateFirmSettings } from '../api/firm';
import { TextField } from '../../../components/ui/text-field';
import { SelectField } from '../../../components/ui/select-field';
import { Button } from '../../../components/ui/button';
import { ErrorPanel, Loading } from '../../../components/ui/card';
import { useToast } from '../../../components/ui/toast';
import { FirmSettingsUpdateSchema } from '../../../../shared/schemas/firm';
import { LIME_METHOD_LABELS, LIME_METHODS } from '../../../../shared/domain/soil-tests';

const FormSchema = z.object({
  limeMethod: z.union([z.enum(LIME_METHODS), z.literal('')]).transform((v) => (v === '' ? null : v)),
  soilRetestYears: z.coerce.number({ message: 'enter whole years' }).pipe(FirmSettingsUpdateSchema.shape.soilRetestYears.unwrap()),
});

/** The owner's soil-test settings: the state method lime is worked by (or the region's) and the years until a retest is due on the Desk. */
export function SoilSettingsForm() {
  const firm = useFirm();
  if (firm.isPending) return <Loading />;
  if (firm.isError) return <ErrorPanel error={firm.error} />;
  const s = firm.data.settings;
  return <SoilSettingsFields region={firm.data.region} defaults={{ limeMethod: s.limeMethod ?? '', soilRetestYears: s.soilRetestYears ?? 3 }} />;
}

function SoilSettingsFields({ region, defaults }: { region: string | null; defaults: z.input<typeof FormSchema> }) {
  const update = useUpdateFirmSettings();
  const toast = useToast();
  const form = useForm<z.input<typeof FormSchema>, unknown, z.output<typeof FormSchema>>({ resolver: zodResolver(FormSchema), defaultValues: defaults });
  const byRegion = region === 'south' || region === 'midsouth' ? 'ncdacs' : 'missouri';
  const submit = form.handleSubmit((v) => update.mutate(v, { onSuccess: () => toast('success', 'Soil-test settings saved; new soil tests use them.'), onError: (e) => toast('error', e.message) }));
  return (
    <form onSubmit={submit} noValidate className="grid gap-3 md:grid-cols-2" aria-label="Soil-test settings">
      <SelectField label="Lime by" hint="Soil tests already saved keep the method they were worked by." error={form.formState.errors.limeMethod?.message} {...form.register('limeMethod')}>
        <option value="">The region’s method ({LIME_METHOD_LABELS[byRegion]})</option>
        {LIME_METHODS.map((m) => (
          <option key={m} value={m}>
            {LIME_METHOD_LABELS[m]}
          </option>
        ))}
      </SelectField>
      <TextField label="Retest soil after (years)" inputMode="numeric" hint="The Desk lists a unit for a new soil test this long after its last (default 3)." error={form.formState.errors.soilRetestYears?.message} {...form.register('soilRetestYears')} />
      <div className="md:col-span-2">
        <Button type="submit" busy={update.isPending}>Save soil-test settings</Button>
      </div>
    </form>
  );
}
