/** The proposal builder's confirm dialogs: send, withdraw, and leave without saving. */
import type { Blocker } from 'react-router-dom';
import { formatCents } from '../../../../shared/domain/money';
import { proposalLabel, type ProposalDto } from '../../../../shared/schemas/proposal-dto';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import type { DraftFormState } from '../hooks/use-draft-form';
import type { ProposalActions } from '../hooks/use-proposal-actions';

/** The three confirmations a draft may ask for. */
export function BuilderDialogs({ proposal, draft, actions, blocker }: { proposal: ProposalDto; draft: DraftFormState; actions: ProposalActions; blocker: Blocker }) {
  const { check, dirty } = draft;
  const { dialog, setDialog, confirmSend, confirmWithdraw } = actions;
  const label = proposalLabel(proposal);
  return (
    <>
      <ConfirmDialog
        open={dialog === 'send'}
        title={`Send ${label} to ${proposal.clientName}?`}
        confirmLabel={dirty ? 'Save and send' : 'Send proposal'}
        busy={actions.sending || actions.saving}
        onConfirm={() => void confirmSend()}
        onCancel={() => setDialog(null)}
      >
        <p>
          They get an e-mail with the PDF and a link to review and approve it in their portal
          {check.totals ? `: ${formatCents(check.totals.totalCents, proposal.currency)}, deposit ${formatCents(check.totals.depositCents, proposal.currency)}` : ''}.
        </p>
        <p className="mt-2 text-slate">
          {dirty ? 'Your unsaved changes are saved first. ' : ''}Once sent, this version cannot change; revise it to make a new version.
        </p>
      </ConfirmDialog>
      <ConfirmDialog
        open={dialog === 'withdraw'}
        title={`Withdraw ${label}?`}
        confirmLabel="Withdraw"
        destructive
        busy={actions.withdrawing}
        onConfirm={confirmWithdraw}
        onCancel={() => setDialog(null)}
      >
        <p>The draft is kept for the record but can no longer be edited or sent.{dirty ? ' Unsaved changes are dropped.' : ''}</p>
      </ConfirmDialog>
      <ConfirmDialog
        open={blocker.state === 'blocked'}
        title="Leave without saving?"
        confirmLabel="Leave and drop changes"
        destructive
        onConfirm={() => blocker.proceed?.()}
        onCancel={() => blocker.reset?.()}
      >
        <p>This draft has changes that are not saved.</p>
      </ConfirmDialog>
    </>
  );
}
