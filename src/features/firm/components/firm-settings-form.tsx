import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { useFirm, useUpdateFirmSettings } from '../api/firm';
import { TextField } from '../../../components/ui/text-field';
import { SelectField } from '../../../components/ui/select-field';
import { formatMoment, isTimeZone, timeZoneChoices } from '../../../../shared/domain/clock';
import { Button } from '../../../components/ui/button';
import { ErrorPanel, Loading } from '../../../components/ui/card';
import { useToast } from '../../../components/ui/toast';

const FormSchema = z.object({
  taxRatePct: z.coerce.number({ message: 'enter the rate as a number' }).min(0, { message: 'cannot be negative' }).max(30, { message: 'above 30 % looks like a typing slip' }),
  timezone: z.string().refine(isTimeZone, { message: 'choose the firm’s time zone from the list' }),
  idleTimeoutHours: z.coerce.number({ message: 'enter the hours as a number' }).min(0.25, { message: 'at least a quarter of an hour' }).max(168, { message: 'at most 168 hours (a week)' }),
  observationSnapFt: z.coerce.number({ message: 'enter the distance in feet' }).min(0, { message: 'cannot be negative' }).max(5280, { message: 'must be at most 5,280 ft (a mile)' }),
});

/** The owner's firm settings (imagery and home area are in the Maps card): the default sales-tax rate, the firm's time zone, the idle sign-out time and how far a field observation snaps to a unit. */
export function FirmSettingsForm() {
  const firm = useFirm();
  if (firm.isPending) return <Loading />;
  if (firm.isError) return <ErrorPanel error={firm.error} />;
  const s = firm.data.settings;
  return <FirmSettingsFields defaults={{ taxRatePct: s.taxRatePct, timezone: firm.data.timezone, idleTimeoutHours: s.idleTimeoutHours, observationSnapFt: s.observationSnapFt }} />;
}

function FirmSettingsFields({ defaults }: { defaults: z.input<typeof FormSchema> }) {
  const update = useUpdateFirmSettings();
  const toast = useToast();
  const form = useForm<z.input<typeof FormSchema>, unknown, z.output<typeof FormSchema>>({ resolver: zodResolver(FormSchema), defaultValues: defaults });
  const zones = timeZoneChoices();
  const zone = form.watch('timezone');
  const submit = form.handleSubmit((v) =>
    update.mutate(
      { taxRatePct: v.taxRatePct, timezone: v.timezone, idleTimeoutHours: v.idleTimeoutHours, observationSnapFt: v.observationSnapFt },
      { onSuccess: () => toast('success', 'Firm settings saved.'), onError: (e) => toast('error', e.message) },
    ),
  );
  return (
    <form onSubmit={submit} noValidate className="grid gap-3 md:grid-cols-2">
      <TextField label="Sales tax rate (%)" inputMode="decimal" hint="The default on new proposals; each proposal can change it." error={form.formState.errors.taxRatePct?.message} {...form.register('taxRatePct')} />
      <SelectField
        label="Time zone"
        hint={isTimeZone(zone) ? `“Today” on every page, e-mail and document is the date here. Now: ${formatMoment(new Date(), zone)}.` : undefined}
        error={form.formState.errors.timezone?.message}
        {...form.register('timezone')}
      >
        {(zones.includes(defaults.timezone) ? zones : [defaults.timezone, ...zones]).map((z) => (
          <option key={z} value={z}>
            {z.replace(/_/g, ' ')}
          </option>
        ))}
      </SelectField>
      <TextField label="Sign out after idle time (hours)" inputMode="decimal" hint="Everyone in the firm is signed out after this long without using Browseline (default 8). Sessions end 14 days after sign-in in any case." error={form.formState.errors.idleTimeoutHours?.message} {...form.register('idleTimeoutHours')} />
      <TextField label="Place a sign on the nearest unit within (ft)" inputMode="decimal" hint="A logged observation outside every unit goes to the nearest unit this close (default 50 ft); farther, it stays on the property without a unit." error={form.formState.errors.observationSnapFt?.message} {...form.register('observationSnapFt')} />
      <div className="md:col-span-2">
        <Button type="submit" busy={update.isPending}>Save firm settings</Button>
      </div>
    </form>
  );
}
