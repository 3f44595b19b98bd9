import { useState, type KeyboardEvent } from 'react';
import { ArchiveControl } from '../../../features/library/components/archive-control';
import { get, useForm, type FieldErrors } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { TextButton } from '../../../components/ui/text-button';
import { Button } from '../../../components/ui/button';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { useToast } from '../../../components/ui/toast';
import { fieldProblems, matchField, sentence } from '../../../lib/api-errors';
import { useRates } from '../../../features/library/api/get-rates';
import { useCreateRate } from '../../../features/library/api/create-rate';
import { useUpdateRate } from '../../../features/library/api/update-rate';
import { useArchiveRate } from '../../../features/library/api/archive-rate';
import { BASIS_LABELS, CATEGORY_LABELS, RATE_FORM_FIELDS, RateFormSchema, rateFormDefaults } from '../../../features/library/lib/rate-form';
import type { RateDto } from '../../../features/library/lib/types';
import { formatCents } from '../../../../shared/domain/money';
import { RATE_BASES } from '../../../../shared/domain/service-rates';

type FormIn = z.input<typeof RateFormSchema>;
type FormOut = z.output<typeof RateFormSchema>;

const inputClass = (error?: string) =>
  `w-full rounded border bg-white px-2 py-1 text-sm text-ink focus:border-moss focus:outline-none focus:ring-2 focus:ring-moss/30 ${error ? 'border-clay' : 'border-rule'}`;

function CellError({ id, message }: { id: string; message?: string }) {
  return message ? (
    <p id={id} className="mt-0.5 text-xs text-[#A04A25]">
      {message}
    </p>
  ) : null;
}

/** One rate as a row of boxes: name, category, basis, price and minimum; Enter or Save stores it. */
function RateEditRow({ rate, onDone }: { rate?: RateDto; onDone: () => void }) {
  const form = useForm<FormIn, unknown, FormOut>({ resolver: zodResolver(RateFormSchema), defaultValues: rateFormDefaults(rate) });
  const create = useCreateRate();
  const update = useUpdateRate();
  const toast = useToast();
  const rowId = `rate-${rate?.id ?? 'new'}`;
  const errors: FieldErrors<FormIn> = form.formState.errors;
  const err = (name: string) => {
    const message = (get(errors, name) as { message?: string } | undefined)?.message;
    return message ? sentence(message) : undefined;
  };
  const a11y = (name: string, label: string) => ({ 'aria-label': label, 'aria-invalid': err(name) ? true : undefined, 'aria-describedby': err(name) ? `${rowId}-${name}-error` : undefined });
  const onError = (error: Error) => {
    let placed = false;
    for (const p of fieldProblems(error)) {
      const field = matchField(p.path, RATE_FORM_FIELDS);
      if (field) {
        form.setError(field as keyof FormIn, { type: 'server', message: p.message });
        placed = true;
      }
    }
    if (!placed) form.setError('root.server', { type: 'server', message: error.message });
    toast('error', placed ? 'Not saved: correct the marked fields.' : error.message);
  };
  const save = form.handleSubmit((input) => {
    if (rate) update.mutate({ id: rate.id, input }, { onSuccess: (r) => (toast('success', `${r.name} saved.`), onDone()), onError });
    else create.mutate({ ...input, minimumCents: input.minimumCents || undefined }, { onSuccess: (r) => (toast('success', `${r.name} added.`), onDone()), onError });
  });
  const onKeyDown = (e: KeyboardEvent) => {
    if (e.key === 'Enter') {
      e.preventDefault();
      void save();
    }
    if (e.key === 'Escape') onDone();
  };
  return (
    <tr className="border-b border-rule/60 bg-paper/60 align-top" onKeyDown={onKeyDown}>
      <td className="py-2 pr-2">
        <input className={inputClass(err('name'))} {...a11y('name', 'Rate name')} {...form.register('name')} />
        <CellError id={`${rowId}-name-error`} message={err('name')} />
        {errors.root?.server ? <p role="alert" className="mt-1 text-xs text-[#A04A25]">{errors.root.server.message}</p> : null}
      </td>
      <td className="py-2 pr-2">
        <select className={inputClass(err('category'))} {...a11y('category', 'Category')} {...form.register('category')}>
          {Object.entries(CATEGORY_LABELS).map(([v, l]) => (
            <option key={v} value={v}>
              {l}
            </option>
          ))}
        </select>
      </td>
      <td className="py-2 pr-2">
        <select className={inputClass(err('basis'))} {...a11y('basis', 'Basis')} {...form.register('basis')}>
          {RATE_BASES.map((b) => (
            <option key={b} value={b}>
              {BASIS_LABELS[b]}
            </option>
          ))}
        </select>
      </td>
      <td className="py-2 pr-2">
        <input className={`${inputClass(err('unitPriceCents'))} text-right`} inputMode="decimal" {...a11y('unitPriceCents', 'Price, $')} {...form.register('unitPriceCents')} />
        <CellError id={`${rowId}-unitPriceCents-error`} message={err('unitPriceCents')} />
      </td>
      <td className="py-2 pr-2">
        <input className={`${inputClass(err('minimumCents'))} text-right`} inputMode="decimal" placeholder="none" {...a11y('minimumCents', 'Minimum charge, $')} {...form.register('minimumCents')} />
        <CellError id={`${rowId}-minimumCents-error`} message={err('minimumCents')} />
      </td>
      <td className="whitespace-nowrap py-2 text-right">
        <Button type="button" onClick={() => void save()} busy={create.isPending || update.isPending}>
          Save
        </Button>{' '}
        <TextButton onClick={onDone}>
          Cancel
        </TextButton>
      </td>
    </tr>
  );
}

function ArchiveRate({ rate }: { rate: RateDto }) {
  const archive = useArchiveRate();
  return <ArchiveControl id={rate.id} name={rate.name} archive={archive} />;
}

/** The firm's labor, equipment and fee rates, edited in place. */
export function RatesPage() {
  const rates = useRates();
  const [editing, setEditing] = useState<number | 'new' | null>(null);
  if (rates.isPending) return <Loading />;
  if (rates.isError) return <ErrorPanel error={rates.error} />;
  return (
    <Card
      title="Rates"
      action={
        editing === 'new' ? null : (
          <Button type="button" onClick={() => setEditing('new')}>
            Add rate
          </Button>
        )
      }
    >
      {rates.data.length === 0 && editing !== 'new' ? (
        <EmptyState title="No rates yet">Add the labor, equipment and fee rates your practices price from.</EmptyState>
      ) : (
        <div className="overflow-x-auto">
          <table className="w-full text-sm">
            <thead>
              <tr className="border-b border-rule text-left text-xs uppercase tracking-wide text-slate">
                <th className="w-[32%] py-2 pr-2 font-semibold">Name</th>
                <th className="py-2 pr-2 font-semibold">Category</th>
                <th className="py-2 pr-2 font-semibold">Basis</th>
                <th className="py-2 pr-2 text-right font-semibold">Price</th>
                <th className="py-2 pr-2 text-right font-semibold">Minimum</th>
                <th className="py-2 text-right font-semibold">
                  <span className="sr-only">Actions</span>
                </th>
              </tr>
            </thead>
            <tbody>
              {editing === 'new' ? <RateEditRow onDone={() => setEditing(null)} /> : null}
              {rates.data.map((r) =>
                editing === r.id ? (
                  <RateEditRow key={r.id} rate={r} onDone={() => setEditing(null)} />
                ) : (
                  <tr key={r.id} className="border-b border-rule/60 last:border-0">
                    <th scope="row" className="py-2 pr-2 text-left font-semibold">
                      {r.name}
                    </th>
                    <td className="py-2 pr-2">{CATEGORY_LABELS[r.category]}</td>
                    <td className="py-2 pr-2 text-slate">{BASIS_LABELS[r.basis]}</td>
                    <td className="py-2 pr-2 text-right tabular-nums">{formatCents(r.unitPriceCents)}</td>
                    <td className="py-2 pr-2 text-right tabular-nums">{r.minimumCents ? formatCents(r.minimumCents) : '—'}</td>
                    <td className="whitespace-nowrap py-1 text-right">
                      <TextButton aria-label={`Edit ${r.name}`} onClick={() => setEditing(r.id)}>
                        Edit
                      </TextButton>
                      <ArchiveRate rate={r} />
                    </td>
                  </tr>
                ),
              )}
            </tbody>
          </table>
        </div>
      )}
    </Card>
  );
}
