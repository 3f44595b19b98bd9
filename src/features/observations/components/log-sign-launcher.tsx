/**
 * The small, eager part of "Log sign": the button, what waits on the phone, what the server refused
 * (with "keep it anyway" when it asked to confirm a far position), and the queue running in the
 * background. The form itself is a lazy chunk.
 */
import { lazy, Suspense, useState } from 'react';
import { Button } from '../../../components/ui/button';
import { Card, Loading } from '../../../components/ui/card';
import { useObservationQueue } from '../hooks/use-observation-queue';
import { newObservationKey } from '../lib/observation-queue';
import { OBSERVATION_KIND_STYLES } from '../../../../shared/domain/observations';

const LogSignForm = lazy(() => import('./log-sign-form'));

export function LogSignLauncher({ userId, properties, defaultPropertyId, mapPosition, onOpenChange, startOpen = false }: { userId: number; properties: { id: number; name: string }[]; defaultPropertyId?: number; mapPosition?: { lon: number; lat: number } | null; onOpenChange?: (open: boolean) => void; startOpen?: boolean }) {
  const queue = useObservationQueue(userId);
  const [open, setOpen] = useState(startOpen);
  const [note, setNote] = useState<string | null>(null);
  const toggle = (next: boolean) => {
    setOpen(next);
    onOpenChange?.(next);
  };
  if (properties.length === 0 && queue.waiting.length === 0 && queue.rejected.length === 0) return null;
  return (
    <Card title="Sign on the ground" action={open ? null : <Button onClick={() => { setNote(null); toggle(true); }}>Log sign</Button>}>
      {note ? (
        <p role="status" className="mb-2 text-sm text-moss-deep">
          {note}
        </p>
      ) : null}
      {queue.waiting.length ? (
        <p role="status" data-testid="observations-waiting" className="mb-2 text-sm text-slate">
          {queue.waiting.length === 1 ? '1 observation is' : `${queue.waiting.length} observations are`} saved on this phone and will be sent when there is signal.
        </p>
      ) : null}
      {queue.rejected.map((item) => (
        <div key={item.key} role="alert" className="mb-2 rounded border border-[#8E3F2A]/40 px-3 py-2 text-sm">
          <p>
            <strong>{OBSERVATION_KIND_STYLES[item.fields.kind].label}</strong> on {item.propertyName} was not kept: {item.rejected?.message}
          </p>
          <div className="mt-1 flex gap-3">
            {item.rejected?.message.includes('confirmFarAway') ? (
              <button
                type="button"
                className="font-semibold text-moss-deep underline"
                onClick={async () => {
                  await queue.dismiss(item.key);
                  const { key: _old, userId: _u, queuedAt: _q, attempts: _a, lastError: _l, rejected: _r, ...rest } = item;
                  await queue.save({ ...rest, key: newObservationKey(), fields: { ...item.fields, confirmFarAway: true } });
                }}
              >
                The position is right: keep it
              </button>
            ) : null}
            <button type="button" className="text-slate underline" onClick={() => queue.dismiss(item.key)}>
              Dismiss
            </button>
          </div>
        </div>
      ))}
      {open ? (
        <Suspense fallback={<Loading label="Opening the form…" />}>
          <LogSignForm
            properties={properties}
            defaultPropertyId={defaultPropertyId}
            mapPosition={mapPosition}
            save={queue.save}
            onDone={(outcome) => {
              setNote(outcome.kind === 'sent' ? 'Sign saved.' : 'Saved on this phone — will send when you’re back online.');
              toggle(false);
            }}
          />
          <button type="button" className="mt-2 text-sm text-slate underline" onClick={() => toggle(false)}>
            Close
          </button>
        </Suspense>
      ) : null}
    </Card>
  );
}
