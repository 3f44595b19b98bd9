/** A sent, decided or withdrawn proposal as the consultant reads it: a document, read-only, with Revise and Withdraw. */
import { useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { Button, buttonClasses } from '../../../components/ui/button';
import { Card } from '../../../components/ui/card';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { PageHeader } from '../../../components/ui/page-header';
import { useToast } from '../../../components/ui/toast';
import { paths } from '../../../config/paths';
import { useReviseProposal } from '../api/revise-proposal';
import { useWithdrawProposal } from '../api/withdraw-proposal';
import { proposalLabel, proposalPdfUrl, type ProposalDto } from '../../../../shared/schemas/proposal-dto';
import { formatDay, formatMoment, formatMomentDay } from '../utils/dates';
import { ApprovalRecord, CautionList, LineItemsByUnit, TermsText, TotalsList, WorkByUnit } from './document-parts';
import { StatusChip } from './status-chip';
import { VersionsList } from './versions-list';

/** Where the proposal stands, in one sentence or record. */
function StateNote({ p }: { p: ProposalDto }) {
  const seen = p.firstViewedAt ? `first opened by the client on ${formatMoment(p.firstViewedAt)}` : 'not opened by the client yet';
  switch (p.status) {
    case 'approved':
      return p.approval ? <ApprovalRecord approval={p.approval} lines={p.lines} showTechnical /> : <p className="text-sm">Approved on {formatMomentDay(p.decidedAt)}.</p>;
    case 'declined':
      return (
        <section aria-label="Decline" className="rounded-md border-l-4 border-clay bg-clay/5 px-4 py-3 text-sm">
          <p className="font-serif text-base font-bold text-[#8E3F2A]">Declined on {p.decidedAt ? formatMoment(p.decidedAt) : '—'}</p>
          <p className="mt-1 whitespace-pre-line">
            <span className="font-semibold">The client’s reason: </span>
            {p.declineReason ?? 'none given'}
          </p>
          <p className="mt-1 text-slate">Revise it to send a new version.</p>
        </section>
      );
    case 'withdrawn':
      return <p className="rounded-md border-l-4 border-slate bg-rule/20 px-4 py-3 text-sm">Withdrawn. The client can read this version but no longer approve it.</p>;
    case 'expired':
      return (
        <p className="rounded-md border-l-4 border-slate bg-rule/20 px-4 py-3 text-sm">
          Expired: it was valid until {formatDay(p.expiresOn)} and the client can no longer approve it. Revise it to send a new version with a later date. Sent {formatMomentDay(p.sentAt)}, {seen}.
        </p>
      );
    default:
      return (
        <p className="rounded-md border-l-4 border-sky bg-sky/5 px-4 py-3 text-sm">
          Sent {p.sentAt ? formatMoment(p.sentAt) : ''}, {seen}. Waiting for the client’s decision{p.expiresOn ? `; valid until ${formatDay(p.expiresOn)}` : ''}.
        </p>
      );
  }
}

/** The read-only proposal for staff. */
export function ProposalDocument({ proposal: p }: { proposal: ProposalDto }) {
  const revise = useReviseProposal();
  const withdraw = useWithdrawProposal();
  const navigate = useNavigate();
  const toast = useToast();
  const [withdrawing, setWithdrawing] = useState(false);
  const label = proposalLabel(p);
  const canWithdraw = p.status === 'sent' || p.status === 'expired';

  const startRevision = () =>
    revise.mutate(p.id, {
      onSuccess: (next) => {
        toast('success', `Version ${next.version} drafted from version ${p.version}.${p.status === 'sent' ? ' The sent version was withdrawn.' : ''}`);
        navigate(paths.proposal(next.id));
      },
      onError: (e) => toast('error', `No new version: ${e.message}`),
    });
  const confirmWithdraw = () =>
    withdraw.mutate(p.id, {
      onSuccess: () => {
        setWithdrawing(false);
        toast('success', `${label} withdrawn.`);
      },
      onError: (e) => {
        setWithdrawing(false);
        toast('error', `Not withdrawn: ${e.message}`);
      },
    });

  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title={p.title}
        crumbs={[
          { label: 'Proposals', to: paths.proposals },
          { label: p.propertyName, to: paths.property(p.propertyId) },
        ]}
        actions={
          <>
            <a href={proposalPdfUrl(p.id)} target="_blank" rel="noopener" className={buttonClasses('secondary')}>
              PDF
            </a>
            {p.status !== 'approved' ? (
              <Button onClick={startRevision} busy={revise.isPending}>
                Revise
              </Button>
            ) : null}
            {canWithdraw ? (
              <Button variant="danger-outline" onClick={() => setWithdrawing(true)}>
                Withdraw
              </Button>
            ) : null}
          </>
        }
      >
        <span className="flex flex-wrap items-center gap-2">
          <span className="font-semibold text-ink">{label}</span>
          <StatusChip status={p.status} />
          <span>
            for {p.clientName} ·{' '}
            <Link to={paths.property(p.propertyId)} className="text-moss-deep underline">
              {p.propertyName}
            </Link>
          </span>
        </span>
      </PageHeader>

      <StateNote p={p} />

      <div className="grid items-start gap-4 xl:grid-cols-[minmax(0,1fr)_24rem]">
        <div className="flex min-w-0 flex-col gap-4">
          {p.introduction ? (
            <Card>
              <p className="whitespace-pre-line">{p.introduction}</p>
            </Card>
          ) : null}
          <Card title="What will be done">
            <WorkByUnit groups={p.groups} />
          </Card>
          <section aria-labelledby="doc-lines" className="flex flex-col gap-2">
            <h2 id="doc-lines" className="text-lg font-bold">
              Line items
            </h2>
            <LineItemsByUnit proposal={p} />
          </section>
        </div>
        <div className="flex flex-col gap-4 xl:sticky xl:top-4">
          <Card title="Totals">
            <TotalsList totals={p} taxRatePct={p.taxRatePct} depositPct={p.depositPct} discount={p.discount} currency={p.currency} />
            {p.status === 'sent' || p.status === 'expired' ? <p className="mt-2 text-xs text-slate">Valid until {formatDay(p.expiresOn)}.</p> : null}
          </Card>
          <VersionsList proposalId={p.id} />
        </div>
      </div>

      <Card title="Terms">
        <TermsText terms={p.terms} />
      </Card>
      {p.cautions.length ? (
        <section aria-labelledby="doc-cautions" className="flex flex-col gap-2">
          <h2 id="doc-cautions" className="text-lg font-bold">
            Cautions
          </h2>
          <CautionList cautions={p.cautions} />
        </section>
      ) : null}

      <ConfirmDialog open={withdrawing} title={`Withdraw ${label}?`} confirmLabel="Withdraw" destructive busy={withdraw.isPending} onConfirm={confirmWithdraw} onCancel={() => setWithdrawing(false)}>
        <p>The client can still read it but can no longer approve it. To change and resend it, use Revise instead.</p>
      </ConfirmDialog>
    </div>
  );
}
