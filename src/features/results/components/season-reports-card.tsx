import { useState } from 'react';
import type { SeasonReportDto } from '../../../../shared/schemas/results';
import { Card, EmptyState } from '../../../components/ui/card';
import { ConfirmDialog } from '../../../components/ui/confirm-dialog';
import { Button, buttonClasses } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/select-field';
import { TextAreaField } from '../../../components/ui/text-area-field';
import { useToast } from '../../../components/ui/toast';
import { formatDate } from '../../../lib/format';
import { useCreateSeasonReport, useSendSeasonReport, useWithdrawSeasonReport } from '../api/season-reports';
import { firmToday } from '../../../lib/firm-clock';
import type { JobDto } from '../../../../shared/schemas/job';

/** The hunting season (July–June) of today, named by the year it starts. */
export function currentSeason(today: string = firmToday()): number {
  const year = Number(today.slice(0, 4));
  return Number(today.slice(5, 7)) >= 7 ? year : year - 1;
}

/** Where a report stands, in words. */
function reportStatus(r: SeasonReportDto): string {
  if (r.withdrawnAt) return `Sent ${r.sentAt ? formatDate(r.sentAt) : ''} · withdrawn from the portal ${formatDate(r.withdrawnAt)}`;
  if (r.sentAt) return `Sent ${formatDate(r.sentAt)} to ${r.sentTo.join(', ')}`;
  return `Made ${formatDate(r.createdAt)} · not sent yet`;
}

function ReportList({
  reports,
  onSend,
  onWithdraw,
  busyId,
}: {
  reports: readonly SeasonReportDto[];
  onSend?: (r: SeasonReportDto) => void;
  onWithdraw?: (r: SeasonReportDto) => void;
  busyId?: number | null;
}) {
  return (
    <ul className="flex flex-col divide-y divide-rule">
      {reports.map((r) => (
        <li key={r.id} className="flex flex-wrap items-center justify-between gap-2 py-2" aria-label={`Season report ${r.seasonLabel}`}>
          <div>
            <p className="font-semibold">Season report {r.seasonLabel}</p>
            <p className="text-sm text-slate">{onSend ? reportStatus(r) : r.sentAt ? `Sent ${formatDate(r.sentAt)}` : ''}</p>
          </div>
          <div className="flex flex-wrap gap-2">
            <a href={r.pdfUrl} target="_blank" rel="noreferrer" className={buttonClasses('secondary', '', 'sm')}>
              {onSend ? 'Preview PDF' : 'Open the report (PDF)'}
            </a>
            {onSend ? (
              <Button size="sm" busy={busyId === r.id} onClick={() => onSend(r)}>
                {r.sentAt ? 'Send again' : 'Send to client'}
              </Button>
            ) : null}
            {onWithdraw && r.sentAt && !r.withdrawnAt ? (
              <Button size="sm" variant="danger-outline" busy={busyId === r.id} onClick={() => onWithdraw(r)}>
                Withdraw from the portal
              </Button>
            ) : null}
          </div>
        </li>
      ))}
    </ul>
  );
}

/** Staff: make a season's report (a PDF) and send it to the landowner. */
export function SeasonReportsCard({ propertyId, reports, seasons }: { propertyId: number; reports: readonly SeasonReportDto[]; seasons: readonly number[] }) {
  const toast = useToast();
  const make = useCreateSeasonReport(propertyId);
  const send = useSendSeasonReport(propertyId);
  const withdraw = useWithdrawSeasonReport(propertyId);
  const choices = [...new Set([currentSeason(), ...seasons])].sort((a, b) => b - a);
  const [season, setSeason] = useState(choices[0]);
  const [recommendations, setRecommendations] = useState('');
  const [progress, setProgress] = useState<JobDto | null>(null);
  const label = (s: number) => `${s}–${String((s + 1) % 100).padStart(2, '0')}`;
  const makeReport = () =>
    make.mutate(
      { propertyId, season, recommendations: recommendations.trim() || null, onProgress: setProgress },
      {
        onSettled: () => setProgress(null),
        onSuccess: (r) => toast('success', `Season report ${r.seasonLabel} made. Preview it, then send it to the client.`),
        onError: (e) => toast('error', `The report was not made: ${e.message}`),
      },
    );
  const sendReport = (r: SeasonReportDto) =>
    send.mutate(r.id, {
      onSuccess: (sent) => toast('success', `Season report ${sent.seasonLabel} sent to ${sent.sentTo.join(', ')}.`),
      onError: (e) => toast('error', `The report was not sent: ${e.message}`),
    });
  const [withdrawing, setWithdrawing] = useState<SeasonReportDto | null>(null);
  const withdrawReport = (r: SeasonReportDto) =>
    withdraw.mutate(r.id, {
      onSuccess: (w) => toast('success', `Season report ${w.seasonLabel} is no longer in the client’s portal.`),
      onError: (e) => toast('error', `The report was not withdrawn: ${e.message}`),
      onSettled: () => setWithdrawing(null),
    });
  const busyId = send.isPending ? (send.variables ?? null) : withdraw.isPending ? (withdraw.variables ?? null) : null;
  return (
    <Card title="Season report">
      <div className="grid gap-3 sm:grid-cols-[12rem_1fr]">
        <SelectField label="Season" value={season} onChange={(e) => setSeason(Number(e.target.value))}>
          {choices.map((s) => (
            <option key={s} value={s}>
              {label(s)} (July–June)
            </option>
          ))}
        </SelectField>
        <TextAreaField
          label="Recommendations for next season"
          hint="Printed in the report; leave a blank line between paragraphs."
          value={recommendations}
          maxLength={4000}
          onChange={(e) => setRecommendations(e.target.value)}
        />
      </div>
      <Button className="mt-3" busy={make.isPending} onClick={makeReport}>
        Make season report
      </Button>
      {make.isPending && progress ? (
        <p className="mt-2 text-sm text-slate" role="status">
          Making the report… {progress.progress} %{progress.step ? ` · ${progress.step}` : ''}
        </p>
      ) : null}
      <div className="mt-4">
        {reports.length === 0 ? (
          <EmptyState title="No season report yet">Make one when the season closes: work done, surveys, harvest and your recommendations, as a PDF.</EmptyState>
        ) : (
          <ReportList reports={reports} onSend={sendReport} onWithdraw={setWithdrawing} busyId={busyId} />
        )}
      </div>
      <ConfirmDialog
        open={withdrawing !== null}
        title={`Withdraw season report ${withdrawing?.seasonLabel ?? ''}?`}
        confirmLabel="Withdraw from the portal"
        destructive
        busy={withdraw.isPending}
        onConfirm={() => withdrawing && withdrawReport(withdrawing)}
        onCancel={() => setWithdrawing(null)}
      >
        <p>The client will no longer see it in their portal. The e-mail already sent cannot be recalled; the firm keeps the report on file, and you can send it again.</p>
      </ConfirmDialog>
    </Card>
  );
}

/** The landowner: the season reports sent to them. */
export function PortalSeasonReports({ reports }: { reports: readonly SeasonReportDto[] }) {
  return (
    <Card title="Season reports">
      {reports.length === 0 ? <EmptyState title="No season report yet">Your consultant sends one when the season closes.</EmptyState> : <ReportList reports={reports} />}
    </Card>
  );
}
