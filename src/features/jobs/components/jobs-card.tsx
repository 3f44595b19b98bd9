import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { Button } from '../../../components/ui/button';
import { useToast } from '../../../components/ui/toast';
import { formatRelative } from '../../../lib/format';
import { useJobs, useRetryJob } from '../api/jobs';
import type { JobDto } from '../../../../shared/schemas/job';

const STATUS: Record<JobDto['status'], { label: string; style: string }> = {
  queued: { label: 'Waiting', style: 'bg-rule/60 text-ink' },
  running: { label: 'Under way', style: 'bg-moss/15 text-moss-deep' },
  retrying: { label: 'Trying again', style: 'bg-ochre/20 text-ink' },
  failed: { label: 'Failed', style: 'bg-clay/15 text-clay' },
  done: { label: 'Done', style: 'bg-moss/15 text-moss-deep' },
};

/** The firm's background work (PDFs for e-mails, season reports): progress, errors and Retry. */
export function JobsCard() {
  const jobs = useJobs();
  const retry = useRetryJob();
  const toast = useToast();
  return (
    <Card title="Background work">
      {jobs.isPending ? (
        <Loading />
      ) : jobs.isError ? (
        <ErrorPanel error={jobs.error} onRetry={() => void jobs.refetch()} />
      ) : jobs.data.length === 0 ? (
        <EmptyState title="Nothing yet">Sending a proposal or an invoice, or making a season report, shows here while it is prepared.</EmptyState>
      ) : (
        <ul className="flex flex-col divide-y divide-rule">
          {jobs.data.map((j) => (
            <li key={j.id} className="flex flex-wrap items-center justify-between gap-2 py-2 text-sm">
              <div className="min-w-0">
                <p className="font-semibold">{j.title}</p>
                <p className="text-slate">
                  {formatRelative(j.createdAt)}
                  {j.status === 'running' ? ` · ${j.progress} %${j.step ? ` · ${j.step}` : ''}` : ''}
                  {j.attempts > 1 ? ` · ${j.attempts} tries` : ''}
                </p>
                {j.lastError ? <p className="text-clay">{j.lastError}</p> : null}
              </div>
              <div className="flex items-center gap-2">
                <span className={`rounded px-2 py-0.5 text-xs ${STATUS[j.status].style}`}>{STATUS[j.status].label}</span>
                {j.status === 'failed' ? (
                  <Button size="sm" variant="secondary" busy={retry.isPending && retry.variables === j.id} onClick={() => retry.mutate(j.id, { onError: (e) => toast('error', e.message) })}>
                    Retry
                  </Button>
                ) : null}
              </div>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
