import { useState } from 'react';
import { Link, useNavigate } from 'react-router-dom';
import { formatCents } from '../../../../shared/domain/money';
import { useInvoices } from '../api/get-invoices';
import { useBillableTasks } from '../api/get-billable-tasks';
import { useCreateInvoice } from '../api/invoice-actions';
import { InvoiceStatusChip } from './invoice-status-chip';
import { Card } from '../../../components/ui/card';
import { Button } from '../../../components/ui/button';
import { useToast } from '../../../components/ui/toast';
import { paths } from '../../../config/paths';

const KIND_LABELS = { deposit: 'Deposit', progress: 'Progress', final: 'Final' } as const;

/** On an approved proposal: its invoices, and the way to create the deposit, a progress invoice (picking done tasks) or the final one. */
export function ProposalInvoicesCard({ proposalId, totalCents }: { proposalId: number; totalCents: number }) {
  const invoices = useInvoices({ proposalId });
  const tasks = useBillableTasks(proposalId);
  const create = useCreateInvoice();
  const navigate = useNavigate();
  const toast = useToast();
  const [picked, setPicked] = useState<number[] | null>(null);
  const live = (invoices.data ?? []).filter((i) => i.status !== 'void');
  const billed = live.reduce((s, i) => s + i.totalCents, 0);

  const make = (kind: 'deposit' | 'progress' | 'final', taskIds?: number[]) =>
    create.mutate(
      { proposalId, kind, ...(taskIds ? { taskIds } : {}) },
      {
        onSuccess: (inv) => {
          toast('success', `${KIND_LABELS[kind]} invoice ${inv.number} is ready as a draft.`);
          navigate(paths.invoice(inv.id));
        },
        onError: (e) => toast('error', `No invoice: ${e.message}`),
      },
    );

  const done = tasks.data ?? [];
  const chosen = picked ?? done.map((t) => t.id);
  return (
    <Card title="Invoices">
      {live.length ? (
        <ul className="mb-3 flex flex-col divide-y divide-rule text-sm">
          {(invoices.data ?? []).map((i) => (
            <li key={i.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
              <Link to={paths.invoice(i.id)} className="font-semibold text-moss-deep hover:underline">
                {i.number} · {KIND_LABELS[i.kind]}
              </Link>
              <span className="flex items-center gap-2 tabular-nums">
                {formatCents(i.totalCents)} <InvoiceStatusChip status={i.status} daysOverdue={i.daysOverdue} />
              </span>
            </li>
          ))}
        </ul>
      ) : (
        <p className="mb-3 text-sm text-slate">No invoices yet. Start with the deposit; bill work as tasks are done; the final invoice bills the rest.</p>
      )}
      <p className="mb-3 text-sm text-slate">
        Billed {formatCents(billed)} of {formatCents(totalCents)}.
      </p>
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" busy={create.isPending && create.variables?.kind === 'deposit'} onClick={() => make('deposit')}>
          Create deposit invoice
        </Button>
        <Button variant="secondary" busy={create.isPending && create.variables?.kind === 'final'} onClick={() => make('final')}>
          Create final invoice
        </Button>
      </div>
      <fieldset className="mt-4 flex flex-col gap-2">
        <legend className="text-sm font-semibold">Progress invoice for done tasks</legend>
        {done.length === 0 ? (
          <p className="text-sm text-slate">No done tasks are waiting to be billed.</p>
        ) : (
          <>
            {done.map((t) => (
              <label key={t.id} className="flex items-center gap-2 text-sm">
                <input type="checkbox" className="h-4 w-4 accent-moss" checked={chosen.includes(t.id)} onChange={(e) => setPicked(e.target.checked ? [...chosen, t.id] : chosen.filter((x) => x !== t.id))} />
                {t.name} — {t.unitName} <span className="ml-auto tabular-nums">{formatCents(t.costCents)}</span>
              </label>
            ))}
            <div>
              <Button variant="secondary" disabled={chosen.length === 0} busy={create.isPending && create.variables?.kind === 'progress'} onClick={() => make('progress', chosen)}>
                Create progress invoice ({chosen.length})
              </Button>
            </div>
          </>
        )}
      </fieldset>
    </Card>
  );
}
