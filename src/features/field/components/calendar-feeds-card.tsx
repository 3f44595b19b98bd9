import { useState } from 'react';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { Button } from '../../../components/ui/button';
import { useToast } from '../../../components/ui/toast';
import { formatDate, formatRelative } from '../../../lib/format';
import { useCalendarFeeds, useCreateCalendarFeed, useRevokeCalendarFeed } from '../api/calendar-feeds';

/** The same feed for calendar apps that subscribe through the webcal scheme. */
export const webcalUrl = (url: string): string => url.replace(/^https?:\/\//, 'webcal://');

function CopyRow({ label, value }: { label: string; value: string }) {
  const toast = useToast();
  return (
    <div className="flex flex-col gap-1">
      <span className="text-xs font-semibold text-slate">{label}</span>
      <div className="flex items-center gap-2">
        <input readOnly value={value} aria-label={label} className="min-w-0 flex-1 rounded border border-rule bg-white px-2 py-2 font-mono text-xs" onFocus={(e) => e.currentTarget.select()} />
        <Button
          type="button"
          variant="secondary"
          size="sm"
          onClick={async () => {
            try {
              await navigator.clipboard.writeText(value);
              toast('success', 'Copied.');
            } catch {
              toast('error', 'This browser would not copy; select the address and copy it by hand.');
            }
          }}
        >
          Copy
        </Button>
      </div>
    </div>
  );
}

/** Your tasks in your own calendar app: make a private feed address (shown once), see active ones, revoke them. */
export function CalendarFeedsCard() {
  const feeds = useCalendarFeeds();
  const create = useCreateCalendarFeed();
  const revoke = useRevokeCalendarFeed();
  const toast = useToast();
  const [fresh, setFresh] = useState<{ id: number; url: string } | null>(null);
  return (
    <Card title="Calendar">
      <p className="mb-3 text-sm text-slate">Subscribe to your scheduled tasks in your phone’s calendar. The address is private: anyone holding it sees your tasks, so revoke it if it leaks.</p>
      {fresh ? (
        <div className="mb-3 flex flex-col gap-2 rounded border border-moss/50 bg-moss/5 p-3" data-testid="new-feed">
          <p className="text-sm font-semibold">Your new feed — copy it now; it is not shown again.</p>
          <CopyRow label="Feed address" value={fresh.url} />
          <CopyRow label="For calendar apps (webcal)" value={webcalUrl(fresh.url)} />
          <a className="text-sm font-semibold text-moss-deep underline" href={webcalUrl(fresh.url)}>
            Open in my calendar app
          </a>
        </div>
      ) : null}
      {feeds.isPending ? <Loading /> : feeds.isError ? <ErrorPanel error={feeds.error} onRetry={() => feeds.refetch()} /> : feeds.data.length === 0 ? (
        <EmptyState title="No calendar feed yet">Make one to see your tasks beside the rest of your week.</EmptyState>
      ) : (
        <ul className="flex flex-col gap-2" aria-label="Active calendar feeds">
          {feeds.data.map((f) => (
            <li key={f.id} className="flex items-center justify-between gap-3 text-sm">
              <span>
                Made {formatDate(f.createdAt)}
                <span className="block text-xs text-slate">{f.lastUsedAt ? `Last read by a calendar ${formatRelative(f.lastUsedAt)}` : 'Not read by a calendar yet'}</span>
              </span>
              <Button
                variant="danger-outline"
                size="sm"
                busy={revoke.isPending && revoke.variables === f.id}
                aria-label={`Revoke the feed made ${formatDate(f.createdAt)}`}
                onClick={async () => {
                  try {
                    await revoke.mutateAsync(f.id);
                    if (fresh?.id === f.id) setFresh(null);
                    toast('success', 'Feed revoked; calendar apps using it get nothing more.');
                  } catch (err) {
                    toast('error', err instanceof Error ? err.message : 'The feed could not be revoked. Try again.');
                  }
                }}
              >
                Revoke
              </Button>
            </li>
          ))}
        </ul>
      )}
      <Button
        variant="secondary"
        className="mt-3"
        busy={create.isPending}
        onClick={async () => {
          try {
            const feed = await create.mutateAsync();
            setFresh(feed.url ? { id: feed.id, url: feed.url } : null);
          } catch (err) {
            toast('error', err instanceof Error ? err.message : 'The feed could not be made. Try again.');
          }
        }}
      >
        Make a calendar feed
      </Button>
    </Card>
  );
}
