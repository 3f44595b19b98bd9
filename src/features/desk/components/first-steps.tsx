import { Link } from 'react-router-dom';
import { Card } from '../../../components/ui/card';
import { paths } from '../../../config/paths';

/**
 * A new firm's short list of what to do first; it goes away once the firm has a client.
 * `profileDone`: the firm has an address, phone or logo (the page reads the firm).
 */
export function FirstSteps({ clients, profileDone }: { clients: number; profileDone: boolean }) {
  if (clients > 0) return null;
  const steps = [
    { done: profileDone, title: 'Fill in your firm’s profile', detail: 'Address, phone, logo and licence numbers print on every proposal, invoice and e-mail.', to: paths.team, action: 'Open settings' },
    { done: false, title: 'Add your first client', detail: 'Then add their property and draw its boundary on the map.', to: paths.clients, action: 'Add a client' },
  ];
  return (
    <Card title="First steps">
      <ol className="flex flex-col gap-3" aria-label="First steps">
        {steps.map((s, i) => (
          <li key={s.title} className="flex items-start gap-3 text-sm">
            <span className={`mt-0.5 flex shrink-0 items-center justify-center rounded-full text-xs font-bold ${s.done ? 'bg-moss text-white' : 'border border-rule text-slate'}`} style={{ width: '1.5rem', height: '1.5rem' }} aria-hidden="true">
              {s.done ? '✓' : i + 1}
            </span>
            <span className="flex-1">
              <span className={`font-semibold ${s.done ? 'text-slate line-through' : 'text-ink'}`}>{s.title}</span>
              <span className="block text-slate">{s.detail}</span>
            </span>
            {s.done ? null : (
              <Link to={s.to} className="shrink-0 text-moss-deep hover:underline">
                {s.action}
              </Link>
            )}
          </li>
        ))}
      </ol>
    </Card>
  );
}
