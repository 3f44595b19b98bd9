/** The proposal builder's figures: the totals card beside the versions, and the sticky bar with the total, deposit, save state and Save. */
import { formatCents } from '../../../../shared/domain/money';
import type { OrderDiscount } from '../../../../shared/domain/proposal-totals';
import type { ProposalDto } from '../../../../shared/schemas/proposal-dto';
import { Button } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import type { DraftFormState } from '../hooks/use-draft-form';
import { countFields, type ProposalActions } from '../hooks/use-proposal-actions';
import { TotalsList } from './document-parts';
import { VersionsList } from './versions-list';

/** The draft's live totals (by the server's rule), its options, and the saved total when they differ. */
export function BuilderTotals({ proposal, draft }: { proposal: ProposalDto; draft: DraftFormState }) {
  const { form, check, dirty } = draft;
  const discountForLabels: OrderDiscount =
    form.discountKind === 'percent' ? { kind: 'percent', percent: form.discountPercent || '0' } : form.discountKind === 'fixed' ? { kind: 'fixed', amountCents: 0 } : { kind: 'none' };
  const options = check.totals?.lines.filter((l) => l.optional) ?? [];
  const savedTotalDiffers = dirty && check.totals && check.totals.totalCents !== proposal.totalCents;
  return (
    <div className="grid items-start gap-4 lg:grid-cols-2">
      <Card title="Totals">
        {check.totals ? (
          <>
            <TotalsList totals={check.totals} taxRatePct={form.taxRatePct} depositPct={form.depositPct} discount={discountForLabels} currency={proposal.currency} label="Totals of this draft" />
            {options.length ? (
              <p className="mt-2 text-sm text-slate">
                {options.length} {options.length === 1 ? 'option' : 'options'} offered, {formatCents(options.reduce((s, l) => s + l.amountCents, 0), proposal.currency)} before tax, not in the total until the client chooses.
              </p>
            ) : null}
            {savedTotalDiffers ? <p className="mt-2 text-sm text-slate">Saved total: {formatCents(proposal.totalCents, proposal.currency)}. Save to keep the new figures.</p> : null}
          </>
        ) : (
          <p className="text-sm text-slate">Totals appear when every quantity, price and percentage is a number. Fix the fields marked in clay.</p>
        )}
      </Card>
      <VersionsList proposalId={proposal.id} />
    </div>
  );
}

/** The bar that stays at the bottom: total, deposit, whether all is saved, and Save. */
export function BuilderSaveBar({ proposal, draft, actions }: { proposal: ProposalDto; draft: DraftFormState; actions: ProposalActions }) {
  const { check, dirty, attempted } = draft;
  const errorCount = Object.keys(check.errors).length;
  return (
    <div className="sticky bottom-0 z-10 -mx-4 flex flex-wrap items-center justify-between gap-3 border-t border-rule bg-card/95 px-4 py-2 backdrop-blur sm:-mx-6 sm:px-6">
      <p className="text-sm">
        <span className="text-slate">Total </span>
        <span className="figure text-lg font-bold" data-testid="sticky-total">
          {check.totals ? formatCents(check.totals.totalCents, proposal.currency) : '—'}
        </span>
        <span className="text-slate"> · deposit </span>
        <span className="figure">{check.totals ? formatCents(check.totals.depositCents, proposal.currency) : '—'}</span>
        <span className="ml-3 text-slate">{dirty ? (attempted && errorCount ? `${countFields(errorCount)} to fix` : 'Unsaved changes') : 'All changes saved'}</span>
      </p>
      <Button size="sm" onClick={() => void actions.save()} busy={actions.saving} disabled={!dirty && !attempted}>
        Save draft
      </Button>
    </div>
  );
}
