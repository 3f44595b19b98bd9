import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { ManualLineFormSchema } from '../../../../shared/schemas/invoice';
import { useAddInvoiceLine } from '../api/invoice-actions';
import { TextField } from '../../../components/ui/text-field';
import { Button } from '../../../components/ui/button';
import { useToast } from '../../../components/ui/toast';

/** Adds a manual line (extra work, a fee) to a draft invoice. */
export function ManualLineForm({ invoiceId }: { invoiceId: number }) {
  const add = useAddInvoiceLine();
  const toast = useToast();
  const form = useForm<z.input<typeof ManualLineFormSchema>, unknown, z.output<typeof ManualLineFormSchema>>({
    resolver: zodResolver(ManualLineFormSchema),
    defaultValues: { description: '', quantity: '1', unit: 'each', unitPrice: '', taxable: false },
  });
  const errors = form.formState.errors;
  const submit = form.handleSubmit(({ unitPrice, ...rest }) =>
    add.mutate(
      { id: invoiceId, line: { ...rest, unitPriceCents: unitPrice } },
      {
        onSuccess: () => {
          toast('success', 'Line added.');
          form.reset();
        },
        onError: (e) => toast('error', `The line was not added: ${e.message}`),
      },
    ),
  );
  return (
    <form onSubmit={submit} noValidate aria-label="Add a line" className="grid gap-3 sm:grid-cols-[2fr_1fr_1fr_1fr]">
      <TextField label="Description" autoComplete="off" error={errors.description?.message} {...form.register('description')} />
      <TextField label="Quantity" inputMode="decimal" error={errors.quantity?.message} {...form.register('quantity')} />
      <TextField label="Unit" autoComplete="off" error={errors.unit?.message} {...form.register('unit')} />
      <TextField label="Unit price ($)" inputMode="decimal" placeholder="65.00" error={errors.unitPrice?.message} {...form.register('unitPrice')} />
      <label className="flex items-center gap-2 text-sm sm:col-span-2">
        <input type="checkbox" className="h-4 w-4 accent-moss" {...form.register('taxable')} /> Taxable (sales tax at the proposal’s rate)
      </label>
      <div className="sm:col-span-2 sm:text-right">
        <Button type="submit" variant="secondary" busy={add.isPending}>
          Add line
        </Button>
      </div>
    </form>
  );
}
