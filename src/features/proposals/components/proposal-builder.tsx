/**
 * The proposal builder: a draft's fields, its lines grouped by unit, live totals computed in the
 * browser by the server's own rule, Save (the full lines array), Send, PDF preview and Withdraw.
 * The state lives in hooks (useDraftForm, useProposalActions, useUnsavedGuard); the parts are
 * builder-*.tsx beside this file.
 */
import { Link } from 'react-router-dom';
import { Button, buttonClasses } from '../../../components/ui/button';
import { PageHeader } from '../../../components/ui/page-header';
import { paths } from '../../../config/paths';
import { proposalLabel, proposalPdfUrl, type ProposalDto } from '../../../../shared/schemas/proposal-dto';
import { useDraftForm } from '../hooks/use-draft-form';
import { useProposalActions } from '../hooks/use-proposal-actions';
import { useUnsavedGuard } from '../hooks/use-unsaved-guard';
import { BuilderDialogs } from './builder-dialogs';
import { BuilderFields } from './builder-fields';
import { Notice } from './builder-line-row';
import { BuilderLines } from './builder-lines';
import { BuilderSaveBar, BuilderTotals } from './builder-totals';
import { StatusChip } from './status-chip';

/** The builder of one draft proposal. */
export function ProposalBuilder({ proposal }: { proposal: ProposalDto }) {
  const draft = useDraftForm(proposal);
  const actions = useProposalActions(proposal, draft);
  const blocker = useUnsavedGuard(draft.dirty);
  const { form, dirty, attempted } = draft;
  const { save, setDialog, busy, notice } = actions;
  const label = proposalLabel(proposal);

  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        title={form.title.trim() || proposal.title}
        crumbs={[
          { label: 'Proposals', to: paths.proposals },
          { label: proposal.propertyName, to: paths.property(proposal.propertyId) },
        ]}
        actions={
          <>
            <Button onClick={() => void save()} busy={actions.saving} disabled={!dirty && !attempted}>
              Save draft
            </Button>
            <Button variant="secondary" onClick={() => setDialog('send')} disabled={busy}>
              Send to client…
            </Button>
            <a href={proposalPdfUrl(proposal.id)} target="_blank" rel="noopener" className={buttonClasses('secondary')}>
              PDF preview
            </a>
            <Button variant="danger-outline" onClick={() => setDialog('withdraw')} disabled={busy}>
              Withdraw
            </Button>
          </>
        }
      >
        <span className="flex flex-wrap items-center gap-2">
          <span className="font-semibold text-ink">{label}</span>
          <StatusChip status="draft" />
          <span>
            for {proposal.clientName} ·{' '}
            <Link to={paths.property(proposal.propertyId)} className="text-moss-deep underline">
              {proposal.propertyName}
            </Link>
          </span>
        </span>
      </PageHeader>

      {notice ? <Notice>{notice}</Notice> : null}

      <BuilderFields draft={draft} />
      <BuilderLines proposal={proposal} draft={draft} />
      <BuilderTotals proposal={proposal} draft={draft} />
      <BuilderSaveBar proposal={proposal} draft={draft} actions={actions} />
      <BuilderDialogs proposal={proposal} draft={draft} actions={actions} blocker={blocker} />
    </div>
  );
}
