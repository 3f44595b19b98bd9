import { Button } from '../../../components/ui/button';
import { useToast } from '../../../components/ui/toast';
import { ApiError } from '../../../lib/api-client';
import { formatDay } from '../../../lib/firm-clock';
import { formatNumber } from '../../../lib/format';
import { CHECK_KIND_LABELS, type UnitCheckDto } from '../../../../shared/schemas/checks';
import { useDecideReseed } from '../api/get-unit-checks';
import { PlotStatusBadge } from './plot-status-badge';

function Figures({ check }: { check: UnitCheckDto }) {
  if (check.kind === 'establishment') {
    return (
      <table className="w-full text-sm tabular-nums">
        <thead>
          <tr className="text-left text-slate">
            <th className="font-semibold">Species</th>
            <th className="text-right font-semibold">Plants/ft²</th>
            <th className="text-right font-semibold">Target</th>
          </tr>
        </thead>
        <tbody>
          {check.result.species.map((s) => (
            <tr key={s.species}>
              <td>{s.species}</td>
              <td className="text-right">{formatNumber(s.plantsPerSqFt, 1)}</td>
              <td className="text-right" title={s.targetSource ?? undefined}>
                {s.targetPlantsPerSqFt ?? '—'}
              </td>
            </tr>
          ))}
        </tbody>
        <caption className="caption-bottom pt-1 text-left text-xs text-slate">
          Ground cover {check.groundCoverPct} %, weed pressure {check.weedPressure}. {check.result.reason} Targets are from memory, not a published table.
        </caption>
      </table>
    );
  }
  if (check.kind === 'browse') {
    return (
      <table className="w-full text-sm tabular-nums">
        <thead>
          <tr className="text-left text-slate">
            <th className="font-semibold">Species</th>
            <th className="text-right font-semibold">Use</th>
            <th className="text-right font-semibold">Preference (Jacobs D)</th>
          </tr>
        </thead>
        <tbody>
          {check.result.species.map((s) => (
            <tr key={s.species}>
              <td>{s.species}</td>
              <td className="text-right">{formatNumber(s.usePct)} %</td>
              <td className="text-right">{s.jacobsD === null ? '—' : s.jacobsD.toFixed(2)}</td>
            </tr>
          ))}
        </tbody>
        <caption className="caption-bottom pt-1 text-left text-xs text-slate">
          {formatNumber(check.result.overallUsePct)} % used overall. D runs from −1 (avoided) to +1 (preferred) (Jacobs 1974).
        </caption>
      </table>
    );
  }
  const r = check.result;
  return (
    <p className="text-sm">
      {formatNumber(r.basalAreaSqFtPerAcre)} ft²/acre basal area over {r.points} point{r.points === 1 ? '' : 's'} (BAF {check.baf})
      {r.treesPerAcre === null ? '' : `, ${formatNumber(r.treesPerAcre)} trees/acre, mean DBH ${formatNumber(r.quadraticMeanDbhIn ?? 0, 1)} in`}
      {r.targetResidualBaSqFtPerAcre === null ? '. No target residual basal area on the prescription.' : r.excessBaSqFtPerAcre ? `: ${formatNumber(r.excessBaSqFtPerAcre)} ft²/acre above the target of ${r.targetResidualBaSqFtPerAcre}.` : `: at or below the target of ${r.targetResidualBaSqFtPerAcre}.`}
    </p>
  );
}

/** A unit's checks, newest first, with their figures and any re-seeding waiting for a decision. */
export function CheckList({ checks, canDecide }: { checks: readonly UnitCheckDto[]; canDecide: boolean }) {
  const decide = useDecideReseed();
  const toast = useToast();
  const answer = (checkId: number, decision: 'accept' | 'reject') =>
    decide.mutate(
      { checkId, decision },
      {
        onSuccess: () => toast('success', decision === 'accept' ? 'Re-seeding prescription written.' : 'Re-seeding rejected.'),
        onError: (e) => toast('error', e instanceof ApiError ? e.message : 'Nothing changed. Try again.'),
      },
    );
  return (
    <ul className="flex flex-col gap-3">
      {checks.map((check) => (
        <li key={check.id} className="rounded border border-rule bg-card p-3">
          <header className="mb-2 flex flex-wrap items-baseline justify-between gap-2">
            <h3 className="font-serif text-sm font-bold">
              {CHECK_KIND_LABELS[check.kind]} · {formatDay(check.checkedOn)}
            </h3>
            <PlotStatusBadge status={check.status} />
          </header>
          <Figures check={check} />
          {check.kind === 'establishment' && check.reseed ? (
            <div className="mt-3 rounded border-l-4 border-ochre bg-ochre/5 px-3 py-2 text-sm">
              <p>
                <strong>Re-seeding {check.reseed.status === 'proposed' ? 'drafted' : check.reseed.status}:</strong> {check.reseed.practiceName ?? 'no seeded prescription on this unit'} at {check.reseed.rateFactor === 1 ? 'the full' : `${formatNumber(check.reseed.rateFactor * 100)} % of the`} seeding rate. {check.reseed.reason}
              </p>
              {check.reseed.status === 'proposed' && canDecide ? (
                <div className="mt-2 flex gap-2">
                  <Button size="sm" busy={decide.isPending} disabled={check.reseed.practiceId === null} onClick={() => answer(check.id, 'accept')}>
                    Accept the re-seeding
                  </Button>
                  <Button size="sm" variant="secondary" disabled={decide.isPending} onClick={() => answer(check.id, 'reject')}>
                    Reject
                  </Button>
                </div>
              ) : null}
            </div>
          ) : null}
        </li>
      ))}
    </ul>
  );
}
