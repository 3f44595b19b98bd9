/**
 * "Stands & wind": today's wind → the stands that suit it with the route to walk in (a phone list and
 * the map), the sit log (offline-safe), each stand's 16 winds with reasons, pressure with its season
 * view, the wind record, and the cautions. Staff and the client's hunters share it; `canEdit` is staff.
 */
import { useState } from 'react';
import type { WindName } from '../../../../shared/domain/stand-winds';
import { useStandWinds } from '../api/stand-winds';
import { usePressure } from '../api/pressure';
import { standsForWind, percent } from '../lib/wind-view';
import { useSitQueue } from '../hooks/use-sit-queue';
import { StandWindMap } from './stand-wind-map';
import { WindPicker } from './wind-picker';
import { StandWindsList } from './stand-winds-list';
import { StandDetailsForm } from './stand-details-form';
import { SitForm } from './sit-form';
import { PressureTable } from './pressure-table';
import { WindRecordCard } from './wind-record-card';
import { HarvestForm } from './harvest-form';
import { useBucks } from '../../../lib/resources/bucks';
import { Card, CautionBox, ErrorPanel, Loading, EmptyState } from '../../../components/ui/card';

export function StandsPage({ propertyId, userId, canEdit }: { propertyId: number; userId: number; canEdit: boolean }) {
  const winds = useStandWinds(propertyId);
  const pressure = usePressure(propertyId);
  const queue = useSitQueue(userId);
  const roster = useBucks(propertyId);
  const [wind, setWind] = useState<WindName | null>(null);
  const [editing, setEditing] = useState<number | null>(null);
  const [sitStand, setSitStand] = useState<number | null>(null);
  const [season, setSeason] = useState(false);

  if (winds.isPending) return <Loading label="Judging the winds…" />;
  if (winds.isError) return <ErrorPanel error={winds.error} onRetry={() => void winds.refetch()} />;
  const answer = winds.data;
  const canLogSits = answer.meta.mayLogSits;
  const today = wind ? standsForWind(answer, wind) : [];
  const editingStand = answer.data.find((s) => s.unitId === editing);

  return (
    <div className="flex flex-col gap-4">
      {answer.meta.cautions.map((c) => (
        <CautionBox key={c.id} title={c.title}>{c.text}</CautionBox>
      ))}
      {answer.data.length === 0 ? <EmptyState title="No stand sites on this plan yet">{canEdit ? 'Place stand sites, bedding areas, sanctuaries and access routes on the plan map; their winds appear here.' : 'Your consultant has not placed stands yet.'}</EmptyState> : null}

      <Card title="Today’s wind">
        <WindPicker value={wind} onChange={setWind} />
        {wind ? (
          <div className="mt-3">
            <h3 className="font-bold">Stands for a wind from {wind}</h3>
            {today.length === 0 ? (
              <p className="text-sm">No stand suits a wind from {wind}: stay out, or hunt another property today.</p>
            ) : (
              <ol className="mt-2 flex flex-col gap-2" aria-label={`Stands for a wind from ${wind}`}>
                {today.map(({ stand, routes }) => (
                  <li key={stand.unitId} className="rounded border border-rule p-3">
                    <p className="font-semibold">{stand.name}</p>
                    <p className="text-sm">{routes.length ? `Walk in by ${routes.map((r) => `“${r.name}”`).join(' or ')}.` : 'No access route is mapped to this stand: come in downwind of where deer are.'}</p>
                    <p className="text-xs text-slate">Huntable hours: {percent(stand.huntableShare)}</p>
                    {canLogSits ? (
                      <button type="button" className="mt-2 min-h-11 rounded bg-moss-deep px-3 text-sm font-semibold text-white" onClick={() => setSitStand(stand.unitId)}>
                        Sit here
                      </button>
                    ) : null}
                  </li>
                ))}
              </ol>
            )}
          </div>
        ) : null}
      </Card>

      {canLogSits && (sitStand !== null || queue.waiting.length > 0 || queue.rejected.length > 0) ? (
        <Card title="Log a sit">
          {!queue.online ? <p className="mb-2 text-sm">You are offline: sits are kept on this phone and sent when the signal is back.</p> : null}
          {queue.waiting.length ? <p role="status" className="mb-2 text-sm">{queue.waiting.length} sit{queue.waiting.length === 1 ? '' : 's'} waiting to send.</p> : null}
          {queue.rejected.map((r) => (
            <p key={r.key} role="alert" className="mb-2 text-sm text-[#8E3F2A]">
              Sit at {r.standName} was refused: {r.rejected?.message} <button type="button" className="underline" onClick={() => void queue.dismiss(r.key)}>Dismiss</button>
            </p>
          ))}
          {sitStand !== null ? <SitForm key={sitStand} propertyId={propertyId} stands={answer.data} standId={sitStand} wind={wind} bucks={roster.data?.map((b) => ({ id: b.id, name: b.name })) ?? []} save={queue.save} /> : null}
        </Card>
      ) : null}

      {canLogSits && answer.data.length ? (
        <Card title="Record a harvest">
          <HarvestForm propertyId={propertyId} stands={answer.data} />
        </Card>
      ) : null}

      <Card
        title={season ? 'Season view' : 'Map'}
        action={
          <button type="button" className="text-sm underline" aria-pressed={season} onClick={() => setSeason((v) => !v)}>
            {season ? 'Show the wind' : 'Show the season’s pressure'}
          </button>
        }
      >
        <StandWindMap answer={answer} wind={wind} pressure={season ? pressure.data?.data : undefined} highlightRouteIds={today.flatMap((t) => t.routes.map((r) => r.id))} title={season ? 'Stands sized by sits this season' : 'Stands, scent cones and access routes'} />
      </Card>

      <Card title="Pressure this season">
        {pressure.data ? <PressureTable rows={pressure.data.data} maxSitsPerWeek={pressure.data.meta.maxSitsPerWeek} /> : <Loading label="Counting sits…" />}
      </Card>

      <Card title="Winds per stand">
        {editingStand && canEdit ? <div className="mb-3"><StandDetailsForm propertyId={propertyId} stand={editingStand} answer={answer} onDone={() => setEditing(null)} /></div> : null}
        <StandWindsList answer={answer} onEdit={canEdit ? setEditing : undefined} />
        {answer.meta.routeWarnings.length ? (
          <ul className="mt-3 flex flex-col gap-1 text-sm" aria-label="Access route checks">
            {answer.meta.routeWarnings.map((w) => (
              <li key={`${w.code}-${w.unitIds.join('-')}`} className="rounded border-l-4 border-ochre bg-ochre/10 px-3 py-1">{w.message}</li>
            ))}
          </ul>
        ) : null}
      </Card>

      <Card title="Wind record">
        <WindRecordCard propertyId={propertyId} canEdit={canEdit} />
      </Card>
    </div>
  );
}
