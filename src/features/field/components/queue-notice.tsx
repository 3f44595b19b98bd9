import { Button } from '../../../components/ui/button';
import { useCompletionQueue } from '../hooks/use-completion-queue';
import { OFFLINE_MESSAGE } from '../lib/completion-queue';
import { formatDay } from '../../../lib/firm-clock';

/** What waits on this phone (with a count and a "Send now") and what the server refused (with its message, until dismissed). */
export function QueueNotice({ showWaiting = true }: { showWaiting?: boolean }) {
  const queue = useCompletionQueue();
  if ((queue.waiting.length === 0 || !showWaiting) && queue.rejected.length === 0) return null;
  return (
    <div className="flex flex-col gap-3">
      {showWaiting && queue.waiting.length > 0 ? (
        <div role="status" data-testid="pending-completions" className="rounded-md border border-ochre bg-ochre/10 px-4 py-3 text-sm text-ink">
          <p className="font-semibold">
            <span data-testid="pending-count">{queue.waiting.length}</span> {queue.waiting.length === 1 ? 'completion' : 'completions'} waiting to send
          </p>
          <p>{queue.online ? 'Sending as soon as Browseline answers.' : OFFLINE_MESSAGE}</p>
          <ul className="mt-1 list-disc pl-5">
            {queue.waiting.map((i) => (
              <li key={i.key}>
                {i.taskName} — {i.unitName}
                {i.photos.length ? ` (${i.photos.length} photo${i.photos.length === 1 ? '' : 's'})` : ''}
              </li>
            ))}
          </ul>
          {queue.online ? (
            <Button variant="secondary" size="sm" className="mt-2" busy={queue.syncing} onClick={queue.syncNow}>
              Send now
            </Button>
          ) : null}
        </div>
      ) : null}
      {queue.rejected.map((i) => (
        <div key={i.key} role="alert" className="rounded-md border border-clay/60 bg-clay/5 px-4 py-3 text-sm text-ink">
          <p className="font-semibold text-[#8E3F2A]">
            “{i.taskName}” on {i.unitName} was not recorded
          </p>
          <p>{i.rejected?.message}</p>
          <p className="mt-1 text-slate">
            Done on {formatDay(i.fields.doneOn)}
            {i.fields.hours ? `, ${i.fields.hours} h` : ''}
            {i.fields.notes ? ` — “${i.fields.notes}”` : ''}. Ask your consultant if the task should be reopened; this copy stays here until you dismiss it.
          </p>
          <Button variant="secondary" size="sm" className="mt-2" onClick={() => void queue.dismiss(i.key)}>
            Dismiss
          </Button>
        </div>
      ))}
    </div>
  );
}
