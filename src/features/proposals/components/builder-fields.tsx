/** The proposal builder's two top cards: the proposal's own fields, and tax, deposit and discount. */
import { Card } from '../../../components/ui/card';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { TextField } from '../../../components/ui/text-field';
import type { DiscountKind } from '../utils/draft-form';
import { formatDay } from '../utils/dates';
import type { DraftFormState } from '../hooks/use-draft-form';

/** Title, expiry, introduction, terms, tax, deposit and discount of a draft. */
export function BuilderFields({ draft }: { draft: DraftFormState }) {
  const { form, errorOf, setField, touch } = draft;
  return (
    <div className="grid items-start gap-4 xl:grid-cols-[minmax(0,1fr)_24rem]">
      <Card title="The proposal">
        <div className="grid gap-3 sm:grid-cols-[minmax(0,1fr)_12rem]">
          <TextField label="Title" value={form.title} maxLength={160} error={errorOf('title')} onChange={(e) => setField('title', e.target.value)} onBlur={() => touch('title')} />
          <TextField
            label="Valid until"
            type="date"
            value={form.expiresOn}
            error={errorOf('expiresOn')}
            hint={form.expiresOn ? `Expires after ${formatDay(form.expiresOn)}.` : 'No expiry date.'}
            onChange={(e) => setField('expiresOn', e.target.value)}
            onBlur={() => touch('expiresOn')}
          />
          <TextAreaField
            label="Introduction"
            className="sm:col-span-2"
            rows={3}
            value={form.introduction}
            error={errorOf('introduction')}
            hint="A few sentences to the landowner: what the plan does for their land."
            onChange={(e) => setField('introduction', e.target.value)}
          />
          <TextAreaField label="Terms" className="sm:col-span-2" rows={6} value={form.terms} error={errorOf('terms')} onChange={(e) => setField('terms', e.target.value)} />
        </div>
      </Card>
      <Card title="Tax, deposit and discount">
        <div className="flex flex-col gap-3">
          <div className="grid grid-cols-2 gap-3">
            <TextField label="Sales tax (%)" inputMode="decimal" value={form.taxRatePct} error={errorOf('taxRatePct')} hint="On lines marked taxable." onChange={(e) => setField('taxRatePct', e.target.value)} onBlur={() => touch('taxRatePct')} />
            <TextField label="Deposit (%)" inputMode="decimal" value={form.depositPct} error={errorOf('depositPct')} hint="Due on approval." onChange={(e) => setField('depositPct', e.target.value)} onBlur={() => touch('depositPct')} />
          </div>
          <fieldset className="flex flex-col gap-2">
            <legend className="mb-1 text-sm font-semibold text-ink">Discount</legend>
            <div className="flex flex-wrap gap-x-4 gap-y-1 text-sm">
              {(
                [
                  ['none', 'None'],
                  ['percent', 'Percent'],
                  ['fixed', 'Fixed amount'],
                ] as [DiscountKind, string][]
              ).map(([kind, text]) => (
                <label key={kind} className="flex items-center gap-1.5">
                  <input type="radio" name="discount-kind" value={kind} checked={form.discountKind === kind} onChange={() => setField('discountKind', kind)} className="accent-moss" />
                  {text}
                </label>
              ))}
            </div>
            {form.discountKind === 'percent' ? (
              <TextField label="Discount (%)" inputMode="decimal" value={form.discountPercent} error={errorOf('discount')} hint="Of the subtotal of included lines." onChange={(e) => setField('discountPercent', e.target.value)} onBlur={() => touch('discount')} />
            ) : form.discountKind === 'fixed' ? (
              <TextField label="Discount ($)" inputMode="decimal" value={form.discountDollars} error={errorOf('discount')} hint="Spread over the lines in proportion to their amounts." onChange={(e) => setField('discountDollars', e.target.value)} onBlur={() => touch('discount')} />
            ) : errorOf('discount') ? (
              <p className="text-sm text-clay">{errorOf('discount')}</p>
            ) : null}
          </fieldset>
        </div>
      </Card>
    </div>
  );
}
