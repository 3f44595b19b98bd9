import { Card, ErrorPanel, Loading } from '../../../components/ui/card';
import { Button } from '../../../components/ui/button';
import { useToast } from '../../../components/ui/toast';
import { formatRelative } from '../../../lib/format';
import { useResendMail, useUndeliveredMail } from '../api/undelivered-mail';

/** The owner's list of e-mail that could not be delivered (given up after 3 days, or still retrying), with "Send again". */
export function UndeliveredMailCard() {
  const mail = useUndeliveredMail();
  const resend = useResendMail();
  const toast = useToast();
  return (
    <Card title="E-mail not delivered">
      {mail.isPending ? (
        <Loading />
      ) : mail.isError ? (
        <ErrorPanel error={mail.error} onRetry={() => void mail.refetch()} />
      ) : mail.data.length === 0 ? (
        <p className="text-sm text-slate">Every e-mail has gone out. Messages that cannot be delivered are retried for 3 days and then listed here.</p>
      ) : (
        <ul className="divide-y divide-rule text-sm">
          {mail.data.map((m) => (
            <li key={m.id} className="flex flex-wrap items-center justify-between gap-3 py-2">
              <div className="min-w-0">
                <p className="font-semibold text-ink">{m.subject}</p>
                <p className="text-slate">
                  To {m.to} · queued {formatRelative(m.queuedAt)} · {m.attempts} {m.attempts === 1 ? 'try' : 'tries'}
                  {m.status === 'failed' ? ' · gave up' : ' · still retrying'}
                </p>
                {m.lastError ? <p className="truncate text-xs text-clay" title={m.lastError}>{m.lastError}</p> : null}
              </div>
              <Button
                size="sm"
                variant="secondary"
                busy={resend.isPending && resend.variables === m.id}
                onClick={() => resend.mutate(m.id, { onSuccess: () => toast('success', `“${m.subject}” is queued again.`), onError: (e) => toast('error', e.message) })}
              >
                Send again
              </Button>
            </li>
          ))}
        </ul>
      )}
    </Card>
  );
}
