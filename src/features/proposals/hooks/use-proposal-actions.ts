/** The proposal builder's actions: Save (the answer, re-priced by the server, becomes the form), Send and Withdraw, with the notice and confirm dialog they use. */
import { useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { formatCents } from '../../../../shared/domain/money';
import { proposalLabel, type ProposalDto } from '../../../../shared/schemas/proposal-dto';
import { useToast } from '../../../components/ui/toast';
import { ApiError } from '../../../lib/api-client';
import { useSendProposal } from '../api/send-proposal';
import { useUpdateProposal } from '../api/update-proposal';
import { useWithdrawProposal } from '../api/withdraw-proposal';
import { serverFieldErrors } from '../utils/draft-form';
import type { DraftFormState } from './use-draft-form';

/** The form's own fields that show an error beside them. */
const SHOWN_FIELDS = new Set(['title', 'expiresOn', 'introduction', 'terms', 'taxRatePct', 'depositPct', 'discount', 'lines']);

/** "1 marked field", "3 marked fields". */
export const countFields = (n: number) => `${n} marked ${n === 1 ? 'field' : 'fields'}`;

/** Save, Send and Withdraw for one draft, over its form. */
export function useProposalActions(proposal: ProposalDto, draft: DraftFormState) {
  const toast = useToast();
  const qc = useQueryClient();
  const update = useUpdateProposal();
  const send = useSendProposal();
  const withdraw = useWithdrawProposal();
  const [notice, setNotice] = useState<string | null>(null);
  const [dialog, setDialog] = useState<null | 'send' | 'withdraw'>(null);
  const label = proposalLabel(proposal);

  const showError = (e: unknown, what: string) => {
    const message = e instanceof Error ? e.message : 'Something went wrong.';
    if (e instanceof ApiError && e.status === 409) void qc.invalidateQueries({ queryKey: ['proposals', 'detail', proposal.id] });
    const fieldErrors = e instanceof ApiError && e.status === 422 ? serverFieldErrors(draft.form, e.message, e.details) : {};
    draft.setServerErrors(fieldErrors);
    const keys = Object.keys(fieldErrors);
    const marked = keys.every((k) => k.startsWith('lines.') || SHOWN_FIELDS.has(k)) ? keys.length : 0;
    const text = marked ? `${what}. Fix the ${countFields(marked)} and try again.` : `${what}: ${message}`;
    setNotice(text);
    toast('error', text);
  };

  /** Saves the draft; the answer (re-priced by the server) becomes the form. */
  const save = async (): Promise<boolean> => {
    draft.setAttempted(true);
    if (!draft.check.input) {
      setNotice(`Fix the ${countFields(Object.keys(draft.check.errors).length)} before saving.`);
      return false;
    }
    try {
      const saved = await update.mutateAsync({ id: proposal.id, input: draft.check.input });
      draft.resetTo(saved);
      setNotice(null);
      toast('success', `${label} saved. Total ${formatCents(saved.totalCents, saved.currency)}.`);
      return true;
    } catch (e) {
      showError(e, 'The draft was not saved');
      return false;
    }
  };

  const confirmSend = async () => {
    if (draft.dirty && !(await save())) return setDialog(null);
    send.mutate(proposal.id, {
      onSuccess: (p) => {
        setDialog(null);
        toast('success', `${label} sent to ${p.clientName}. It is read-only now.`);
      },
      onError: (e) => {
        setDialog(null);
        showError(e, 'The proposal was not sent');
      },
    });
  };
  const confirmWithdraw = () =>
    withdraw.mutate(proposal.id, {
      onSuccess: () => {
        setDialog(null);
        draft.markClean();
        toast('success', `${label} withdrawn.`);
      },
      onError: (e) => {
        setDialog(null);
        showError(e, 'The proposal was not withdrawn');
      },
    });

  return {
    notice,
    dialog,
    setDialog,
    save,
    confirmSend,
    confirmWithdraw,
    saving: update.isPending,
    sending: send.isPending,
    withdrawing: withdraw.isPending,
    busy: update.isPending || send.isPending || withdraw.isPending,
  };
}

/** What useProposalActions gives. */
export type ProposalActions = ReturnType<typeof useProposalActions>;
