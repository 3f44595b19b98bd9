import { useRef } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import type { FirmDto } from '../../../../shared/schemas/firm';
import { LOGO_LIMITS } from '../../../../shared/limits';
import { useFirm, useUpdateFirmProfile, useUploadFirmLogo } from '../api/firm';
import { TextField } from '../../../components/ui/text-field';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { SelectField } from '../../../components/ui/select-field';
import { Button } from '../../../components/ui/button';
import { ErrorPanel, Loading } from '../../../components/ui/card';
import { useToast } from '../../../components/ui/toast';

// One-off sizes as inline styles: new utility classes would grow the stylesheet every page (the field sheet too) loads first.
const LOGO_BOX = { height: '4rem' } as const;
const LOGO_IMAGE = { maxHeight: '3.5rem', maxWidth: '9rem', objectFit: 'contain' } as const;

const whole = (what: string, min: number, max: number) =>
  z.coerce.number({ message: `enter ${what} as a number` }).int({ message: `${what} is in whole days` }).min(min, { message: `at least ${min}` }).max(max, { message: `at most ${max}` });

const FormSchema = z.object({
  name: z.string().trim().min(1, { message: 'the firm needs a name' }).max(120),
  address: z.string().max(300),
  phone: z.string().max(40),
  email: z.union([z.literal(''), z.string().trim().email({ message: 'enter an e-mail address such as office@example.com' })]),
  website: z.union([z.literal(''), z.string().trim().regex(/^https?:\/\/[^\s/]+\.\S+$/, { message: 'start the website with https:// and the address' })]),
  licenceNumbers: z.string().max(300),
  defaultDepositPct: z.coerce.number({ message: 'enter the deposit as a number' }).min(0, { message: 'cannot be negative' }).max(100, { message: 'at most 100 %' }),
  paymentTermsDays: whole('payment terms', 0, 365),
  proposalValidDays: whole('validity', 1, 365),
  areaUnit: z.enum(['acres', 'hectares']),
  lengthUnit: z.enum(['feet', 'metres']),
});

/** The owner's firm profile: what every proposal, invoice and e-mail prints, the logo, and the defaults of new documents. */
export function FirmProfileForm() {
  const firm = useFirm();
  if (firm.isPending) return <Loading />;
  if (firm.isError) return <ErrorPanel error={firm.error} />;
  return <FirmProfileFields firm={firm.data} />;
}

function FirmProfileFields({ firm }: { firm: FirmDto }) {
  const update = useUpdateFirmProfile();
  const toast = useToast();
  const defaults: z.input<typeof FormSchema> = {
    name: firm.name,
    address: firm.address ?? '',
    phone: firm.phone ?? '',
    email: firm.email ?? '',
    website: firm.website ?? '',
    licenceNumbers: firm.licenceNumbers ?? '',
    defaultDepositPct: firm.defaultDepositPct,
    paymentTermsDays: firm.paymentTermsDays,
    proposalValidDays: firm.proposalValidDays,
    areaUnit: firm.areaUnit,
    lengthUnit: firm.lengthUnit,
  };
  const form = useForm<z.input<typeof FormSchema>, unknown, z.output<typeof FormSchema>>({ resolver: zodResolver(FormSchema), defaultValues: defaults });
  const err = form.formState.errors;
  const submit = form.handleSubmit((v) =>
    update.mutate(
      { ...v, address: v.address || null, phone: v.phone || null, email: v.email || null, website: v.website || null, licenceNumbers: v.licenceNumbers || null },
      { onSuccess: () => toast('success', 'Firm profile saved. New documents and e-mails print it.'), onError: (e) => toast('error', e.message) },
    ),
  );
  return (
    <div className="flex flex-col gap-4">
      <LogoPicker logoUrl={firm.logoUrl} />
      <form onSubmit={submit} noValidate className="grid gap-3 md:grid-cols-2" aria-label="Firm profile">
        <TextField label="Firm name" error={err.name?.message} {...form.register('name')} />
        <TextField label="Phone" autoComplete="tel" error={err.phone?.message} {...form.register('phone')} />
        <TextAreaField label="Postal address" rows={3} error={err.address?.message} {...form.register('address')} />
        <TextAreaField label="Licence or certification numbers" rows={3} hint="Printed under the address, one per line." error={err.licenceNumbers?.message} {...form.register('licenceNumbers')} />
        <TextField label="E-mail" type="email" autoComplete="email" error={err.email?.message} {...form.register('email')} />
        <TextField label="Website" placeholder="https://example.com" error={err.website?.message} {...form.register('website')} />
        <TextField label="Default deposit (%)" inputMode="decimal" hint="New proposals start with it." error={err.defaultDepositPct?.message} {...form.register('defaultDepositPct')} />
        <TextField label="Payment terms (days)" inputMode="numeric" hint="An invoice is due this many days after it is sent." error={err.paymentTermsDays?.message} {...form.register('paymentTermsDays')} />
        <TextField label="Proposals valid for (days)" inputMode="numeric" error={err.proposalValidDays?.message} {...form.register('proposalValidDays')} />
        <div className="grid grid-cols-2 gap-3">
          <SelectField label="Areas in" {...form.register('areaUnit')}>
            <option value="acres">acres</option>
            <option value="hectares">hectares</option>
          </SelectField>
          <SelectField label="Lengths in" {...form.register('lengthUnit')}>
            <option value="feet">feet</option>
            <option value="metres">metres</option>
          </SelectField>
        </div>
        <div className="md:col-span-2">
          <Button type="submit" busy={update.isPending}>Save firm profile</Button>
        </div>
      </form>
    </div>
  );
}

function LogoPicker({ logoUrl }: { logoUrl: string | null }) {
  const upload = useUploadFirmLogo();
  const toast = useToast();
  const input = useRef<HTMLInputElement>(null);
  const pick = (file: File | undefined) => {
    if (!file) return;
    if (file.size > LOGO_LIMITS.maxBytes) {
      toast('error', `The logo is larger than ${LOGO_LIMITS.maxBytes / 1024 / 1024} MB. Save it smaller and try again.`);
      return;
    }
    upload.mutate(file, { onSuccess: () => toast('success', 'Logo saved.'), onError: (e) => toast('error', e.message) });
  };
  return (
    <div className="flex items-center gap-4">
      <div className="flex w-40 items-center justify-center rounded border border-rule bg-white" style={LOGO_BOX}>
        {logoUrl ? <img src={logoUrl} alt="The firm’s logo" style={LOGO_IMAGE} /> : <span className="text-xs text-slate">No logo yet</span>}
      </div>
      <div className="flex flex-col gap-1">
        <label className="text-sm font-semibold text-ink" htmlFor="firm-logo">
          Logo (PNG or JPEG)
        </label>
        <input id="firm-logo" ref={input} type="file" accept="image/png,image/jpeg" className="text-sm" disabled={upload.isPending} onChange={(e) => pick(e.target.files?.[0])} />
        <p className="text-xs text-slate">At most 1 MB and {LOGO_LIMITS.maxSide} pixels on a side. Printed at the top of proposals and invoices.</p>
      </div>
    </div>
  );
}
