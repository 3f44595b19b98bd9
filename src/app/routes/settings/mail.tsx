import { useState } from 'react';
import { useCapturedMail, useCapturedMessage } from '../../../features/team/api/team';
import { Card, EmptyState, ErrorPanel, Loading } from '../../../components/ui/card';
import { formatRelative } from '../../../lib/format';

/** Development only: the messages the local SMTP capture server received. */
export function MailPage() {
  const list = useCapturedMail();
  const [selected, setSelected] = useState<number | null>(null);
  const message = useCapturedMessage(selected);
  return (
    <div className="flex flex-col gap-4">
      <div>
        <h1 className="text-2xl font-bold">Captured mail</h1>
        <p className="text-sm text-slate">In development Browseline delivers e-mail to a local capture server instead of real inboxes. Nothing here left this machine.</p>
      </div>
      <div className="grid gap-4 lg:grid-cols-[20rem_1fr]">
        <Card title="Messages">
          {list.isPending ? <Loading /> : list.isError ? <ErrorPanel error={list.error} /> : list.data.length === 0 ? (
            <EmptyState title="No mail yet">Invite someone or send a password reset to see it here.</EmptyState>
          ) : (
            <ul className="flex flex-col divide-y divide-rule">
              {list.data.map((m) => (
                <li key={m.id}>
                  <button className={`w-full px-2 py-2 text-left text-sm ${selected === m.id ? 'bg-moss/10' : 'hover:bg-rule/30'}`} onClick={() => setSelected(m.id)}>
                    <span className="block font-semibold">{m.subject}</span>
                    <span className="block text-xs text-slate">to {m.to.join(', ')} · {formatRelative(m.receivedAt)}</span>
                  </button>
                </li>
              ))}
            </ul>
          )}
        </Card>
        <Card title={message.data?.subject ?? 'Message'}>
          {selected === null ? <p className="text-sm text-slate">Choose a message.</p> : message.isPending ? <Loading /> : message.isError ? <ErrorPanel error={message.error} /> : (
            <div className="flex flex-col gap-2 text-sm">
              <p className="text-slate">To {message.data.to.join(', ')}</p>
              {message.data.attachments.length ? <p className="text-slate">Attachments: {message.data.attachments.map((a) => a.filename).join(', ')}</p> : null}
              <pre className="whitespace-pre-wrap break-words rounded bg-paper p-3 font-sans">{message.data.text}</pre>
            </div>
          )}
        </Card>
      </div>
    </div>
  );
}
