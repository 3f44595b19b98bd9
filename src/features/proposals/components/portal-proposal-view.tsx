/**
 * The landowner's proposal: a calm document, phone first. Options are checkboxes that re-price the
 * totals live by the shared rule; approval is a typed name; declining asks for a reason.
 */
import { useId, useMemo, useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { formatCents } from '../../../../shared/domain/money';
import { ApproveSchema, DeclineSchema } from '../../../../shared/schemas/proposal';
import { Button, buttonClasses } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { TextField } from '../../../components/ui/text-field';
import { useToast } from '../../../components/ui/toast';
import { paths } from '../../../config/paths';
import { ApiError } from '../../../lib/api-client';
import { useApproveProposal } from '../api/approve-proposal';
import { useDeclineProposal } from '../api/decline-proposal';
import { proposalPdfUrl, type ProposalDto } from '../../../../shared/schemas/proposal-dto';
import { totalsWithOptions } from '../utils/client-totals';
import { formatDay, formatMoment } from '../utils/dates';
import { ApprovalRecord, CautionList, LineItemsByUnit, TermsText, TotalsList, WorkByUnit } from './document-parts';
import { StatusChip } from './status-chip';

/** What the client reads at the top, by state. */
function StatusLine({ p }: { p: ProposalDto }) {
  const text: Record<ProposalDto['status'], string> = {
    draft: '',
    sent: p.expiresOn ? `Waiting for your decision. The prices hold until ${formatDay(p.expiresOn)}.` : 'Waiting for your decision.',
    approved: 'You approved this proposal. Your consultant will schedule the work.',
    declined: 'You declined this proposal. Your consultant may send a new version.',
    withdrawn: 'Your consultant withdrew this version. Look for a newer version under Proposals.',
    expired: `This proposal expired on ${formatDay(p.expiresOn)}. Ask your consultant to renew it.`,
  };
  return <p className="text-sm text-ink">{text[p.status]}</p>;
}

/** A 409 from approve or decline, in words for the landowner. */
function conflictMessage(e: ApiError): string {
  return `${e.message} The page now shows the proposal as it stands.`;
}

/** The proposal for its client, with the one action it needs. */
export function PortalProposalView({ proposal: p }: { proposal: ProposalDto }) {
  const open = p.status === 'sent';
  const options = p.lines.filter((l) => l.optional);
  const [chosen, setChosen] = useState<ReadonlySet<number>>(() => new Set(options.filter((l) => l.selected).map((l) => l.id)));
  const [signedName, setSignedName] = useState('');
  const [nameError, setNameError] = useState<string | undefined>();
  const [declining, setDeclining] = useState(false);
  const [reason, setReason] = useState('');
  const [reasonError, setReasonError] = useState<string | undefined>();
  const [problem, setProblem] = useState<string | null>(null);
  const approve = useApproveProposal();
  const decline = useDeclineProposal();
  const toast = useToast();
  const qc = useQueryClient();
  const optionsId = useId();

  const totals = useMemo(() => (open ? totalsWithOptions(p, chosen) : null), [open, p, chosen]);
  const shown = totals ?? p;
  const includedOf = open ? (l: ProposalDto['lines'][number]) => (l.optional ? chosen.has(l.id) : true) : undefined;

  const onDecisionError = (e: Error, what: string) => {
    if (e instanceof ApiError && e.status === 409) {
      setProblem(conflictMessage(e));
      void qc.invalidateQueries({ queryKey: ['proposals'] });
    } else if (e instanceof ApiError && e.status === 422 && what === 'approve') {
      setNameError(e.message);
    } else setProblem(`${e.message}`);
    toast('error', what === 'approve' ? 'The proposal was not approved.' : 'The proposal was not declined.');
  };

  const submitApproval = (e: FormEvent) => {
    e.preventDefault();
    setProblem(null);
    const parsed = ApproveSchema.safeParse({ signedName, optionIds: [...chosen] });
    if (!parsed.success) return setNameError('Type your full name to approve (at least 3 letters).');
    setNameError(undefined);
    approve.mutate(
      { id: p.id, input: parsed.data },
      {
        onSuccess: (saved) => {
          toast('success', `Approved. Thank you, ${saved.approval?.signedName ?? signedName.trim()}.`);
          window.scrollTo({ top: 0 });
        },
        onError: (err) => onDecisionError(err, 'approve'),
      },
    );
  };
  const submitDecline = (e: FormEvent) => {
    e.preventDefault();
    setProblem(null);
    const parsed = DeclineSchema.safeParse({ reason });
    if (!parsed.success) return setReasonError('Tell your consultant briefly why (a few words are enough).');
    setReasonError(undefined);
    decline.mutate(
      { id: p.id, reason: parsed.data.reason },
      {
        onSuccess: () => {
          toast('success', 'Declined. Your consultant has been told.');
          window.scrollTo({ top: 0 });
        },
        onError: (err) => onDecisionError(err, 'decline'),
      },
    );
  };

  return (
    <article aria-labelledby="proposal-title" className="flex flex-col gap-4">
      <header className="flex flex-col gap-1">
        <Link to={paths.portalProposals} className="text-sm text-moss-deep underline">
          ← All proposals
        </Link>
        <p className="text-xs uppercase tracking-wide text-slate">
          Proposal {p.number} · version {p.version}
        </p>
        <h1 id="proposal-title" className="text-2xl font-bold leading-snug">
          {p.title}
        </h1>
        <p className="text-slate">
          For {p.propertyName} · {p.clientName}
        </p>
        <div className="mt-1 flex flex-wrap items-center gap-2">
          <StatusChip status={p.status} />
          <a href={proposalPdfUrl(p.id)} target="_blank" rel="noopener" className="text-sm font-semibold text-moss-deep underline">
            Download the PDF
          </a>
        </div>
        <StatusLine p={p} />
      </header>

      {problem ? (
        <div role="alert" className="rounded-md border-l-4 border-clay bg-clay/5 px-4 py-3 text-sm">
          {problem}
        </div>
      ) : null}

      {p.status === 'approved' && p.approval ? <ApprovalRecord approval={p.approval} lines={p.lines} /> : null}
      {p.status === 'declined' ? (
        <section aria-label="Your decision" className="rounded-md border-l-4 border-clay bg-clay/5 px-4 py-3 text-sm">
          <p className="font-semibold text-[#8E3F2A]">You declined this on {p.decidedAt ? formatMoment(p.decidedAt) : '—'}.</p>
          {p.declineReason ? <p className="mt-1 whitespace-pre-line">Your reason: {p.declineReason}</p> : null}
        </section>
      ) : null}

      {p.introduction ? <p className="whitespace-pre-line leading-relaxed">{p.introduction}</p> : null}

      <Card title="What will be done">
        <WorkByUnit groups={p.groups} />
      </Card>

      {options.length ? (
        <Card title={open ? 'Options you can add' : 'Options'}>
          <fieldset aria-describedby={optionsId} className="flex flex-col gap-2">
            <legend className="sr-only">Options</legend>
            <p id={optionsId} className="text-sm text-slate">
              {open ? 'Tick an option to add it; the price below changes as you do.' : 'The options as decided.'}
            </p>
            {options.map((l) => {
              const checked = open ? chosen.has(l.id) : l.selected;
              return (
                <label key={l.id} className={`flex items-start gap-3 rounded border px-3 py-3 ${checked ? 'border-moss bg-moss/5' : 'border-rule bg-card'}`}>
                  <input
                    type="checkbox"
                    className="mt-1 size-5 shrink-0 accent-moss"
                    checked={checked}
                    disabled={!open}
                    onChange={(e) =>
                      setChosen((prev) => {
                        const next = new Set(prev);
                        if (e.target.checked) next.add(l.id);
                        else next.delete(l.id);
                        return next;
                      })
                    }
                  />
                  <span className="flex min-w-0 flex-1 flex-col">
                    <span className="font-semibold">{l.description}</span>
                    <span className="text-sm text-slate">{l.groupLabel}</span>
                  </span>
                  <span className="figure whitespace-nowrap">+{formatCents(l.amountCents, p.currency)}</span>
                </label>
              );
            })}
          </fieldset>
        </Card>
      ) : null}

      <Card title="Price">
        <TotalsList totals={shown} taxRatePct={p.taxRatePct} depositPct={p.depositPct} discount={p.discount} currency={p.currency} label="Price" />
        {open ? (
          <p className="mt-2 rounded bg-paper px-3 py-2 text-sm">
            <span className="figure font-bold">{formatCents(shown.depositCents, p.currency)}</span> deposit is due when you approve; the rest is invoiced as the work is done.
          </p>
        ) : null}
      </Card>

      <section aria-labelledby="line-items" className="flex flex-col gap-2">
        <h2 id="line-items" className="text-lg font-bold">
          Line items by unit
        </h2>
        <LineItemsByUnit proposal={p} collapsible includedOf={includedOf} />
      </section>

      <Card title="Terms">
        <TermsText terms={p.terms} />
      </Card>

      {p.cautions.length ? (
        <section aria-labelledby="cautions" className="flex flex-col gap-2">
          <h2 id="cautions" className="text-lg font-bold">
            Before the work starts
          </h2>
          <CautionList cautions={p.cautions} />
        </section>
      ) : null}

      {open ? (
        <Card title="Your decision">
          {!declining ? (
            <form onSubmit={submitApproval} noValidate aria-label="Approve the proposal" className="flex flex-col gap-3">
              <TextField
                label="Type your full name to approve"
                autoComplete="name"
                value={signedName}
                error={nameError}
                hint="Your typed name is your signature. It is kept with the date and a fingerprint of this exact proposal."
                onChange={(e) => setSignedName(e.target.value)}
              />
              {totals ? (
                <p className="text-sm">
                  A deposit of <span className="figure font-bold">{formatCents(totals.depositCents, p.currency)}</span> is due when you approve.
                </p>
              ) : null}
              <Button type="submit" busy={approve.isPending} className="w-full py-3 text-base sm:w-auto">
                Approve{totals ? ` · ${formatCents(totals.totalCents, p.currency)}` : ''}
              </Button>
              <p className="text-sm text-slate">
                Not right for you?{' '}
                <button type="button" className="font-semibold text-clay underline" onClick={() => setDeclining(true)}>
                  Decline
                </button>
              </p>
            </form>
          ) : (
            <form onSubmit={submitDecline} noValidate aria-label="Decline the proposal" className="flex flex-col gap-3">
              <TextAreaField label="Why are you declining?" rows={4} value={reason} error={reasonError} hint="Your consultant reads this and can send a new version." onChange={(e) => setReason(e.target.value)} />
              <div className="flex flex-wrap gap-2">
                <Button type="submit" variant="danger" busy={decline.isPending}>
                  Decline proposal
                </Button>
                <Button type="button" variant="secondary" onClick={() => setDeclining(false)}>
                  Back to approving
                </Button>
              </div>
            </form>
          )}
        </Card>
      ) : null}

      <p className="pb-4 text-center text-sm">
        <a href={proposalPdfUrl(p.id)} target="_blank" rel="noopener" className={buttonClasses('secondary')}>
          Download the PDF
        </a>
      </p>
    </article>
  );
}
