import { Link } from 'react-router-dom';
import { Card } from '../../../components/ui/card';
import { paths } from '../../../config/paths';
import type { DeskSummary } from '../../../../shared/schemas/desk';
import type { FirstStepKey } from '../../../../shared/domain/first-steps';

const STEPS: Record<FirstStepKey, { title: string; detail: string; to: string; action: string }> = {
  'home-area': { title: 'Choose where you work', detail: 'New properties’ maps open on your home area, so finding the farm takes a moment.', to: paths.team, action: 'Set the home area' },
  profile: { title: 'Fill in your firm’s profile', detail: 'Address, phone, logo and licence numbers print on every proposal, invoice and e-mail.', to: paths.team, action: 'Open settings' },
  'first-client': { title: 'Add your first client', detail: 'Then add their property and draw its boundary on the map.', to: paths.clients, action: 'Add a client' },
};

/** A new firm's short list of what to do first; each step ticks itself off, and the list goes once all are done. */
export function FirstSteps({ steps }: { steps: DeskSummary['firstSteps'] }) {
  if (!steps) return null;
  return (
    <Card title="First steps">
      <ol className="flex flex-col gap-3" aria-label="First steps">
        {steps.map((step, i) => {
          const s = STEPS[step.key];
          return (
            <li key={step.key} className="flex items-start gap-3 text-sm" data-done={step.done}>
              <span className={`mt-0.5 flex shrink-0 items-center justify-center rounded-full text-xs font-bold ${step.done ? 'bg-moss text-white' : 'border border-rule text-slate'}`} style={{ width: '1.5rem', height: '1.5rem' }} aria-hidden="true">
                {step.done ? '✓' : i + 1}
              </span>
              <span className="flex-1">
                <span className={`font-semibold ${step.done ? 'text-slate line-through' : 'text-ink'}`}>
                  {s.title}
                  {step.done ? <span className="sr-only"> (done)</span> : null}
                </span>
                <span className="block text-slate">{s.detail}</span>
              </span>
              {step.done ? null : (
                <Link to={s.to} className="shrink-0 text-moss-deep hover:underline">
                  {s.action}
                </Link>
              )}
            </li>
          );
        })}
      </ol>
    </Card>
  );
}
