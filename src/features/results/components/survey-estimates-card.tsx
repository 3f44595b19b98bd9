import type { ReactNode } from 'react';
import type { Caution } from '../../../../shared/domain/cautions';
import type { SurveyDto } from '../../../../shared/schemas/results';
import { Card, CautionBox } from '../../../components/ui/card';
import { formatDate } from '../../../lib/format';

function Figure({ label, value, big = false }: { label: string; value: string; big?: boolean }) {
  return (
    <div className="min-w-0">
      <dt className="text-xs uppercase tracking-wide text-slate">{label}</dt>
      <dd className={`tabular-nums text-ink ${big ? 'figure font-serif text-2xl font-bold text-moss-deep' : 'font-semibold'}`}>{value}</dd>
    </div>
  );
}

const day = (iso: string) => formatDate(`${iso}T12:00:00`);

/** One survey's estimates, its warnings, the method's notes and the baiting caution. */
export function SurveyEstimatesCard({ survey, cautions, action }: { survey: SurveyDto; cautions: readonly Caution[]; action?: ReactNode }) {
  const d = survey.display;
  const warnings = survey.warnings.filter((w) => w.severity === 'warning');
  const notes = survey.warnings.filter((w) => w.severity === 'note');
  return (
    <article aria-label={survey.name}>
      <Card title={survey.name} action={action}>
        <p className="mb-3 text-sm text-slate">
          {day(survey.startDate)} – {day(survey.endDate)} · {survey.surveyDays} days · {survey.cameraCount} {survey.cameraCount === 1 ? 'camera' : 'cameras'}
          {survey.cameras.length > 0 ? ` (${survey.cameras.map((c) => c.name).join(', ')})` : ''}
        </p>
        {d ? (
          <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4" aria-label={`Estimates of ${survey.name}`}>
            <Figure label="Total deer" value={d.total} big />
            <Figure label="Deer per mi²" value={d.deerPerSqMi} big />
            <Figure label="Buck:doe" value={d.buckDoeRatio} big />
            <Figure label="Fawns per doe" value={d.fawnDoeRatio} big />
            <Figure label="Bucks" value={d.bucks} />
            <Figure label="Does" value={d.does} />
            <Figure label="Fawns" value={d.fawns} />
            <Figure label="Photos per buck" value={d.photosPerBuck} />
          </dl>
        ) : null}
        {survey.bucks.length > 0 ? (
          <p className="mt-3 text-sm">
            <span className="font-semibold">Bucks told apart: </span>
            {survey.bucks.map((b) => `${b.label} (${b.ageClass === 'fawn' ? 'fawn' : b.ageClass})`).join(', ')}
          </p>
        ) : null}
        <div className="mt-3 flex flex-col gap-2">
          {warnings.map((w) => (
            <CautionBox key={w.code} title={w.code === 'camera-density-low' ? 'Too few cameras' : w.code === 'survey-short' ? 'Short survey' : 'Check the survey'}>
              <p>{w.message}</p>
            </CautionBox>
          ))}
          <ul className="list-disc pl-5 text-sm text-slate">
            {notes.map((n) => (
              <li key={n.code}>{n.message}</li>
            ))}
          </ul>
          {cautions.map((c) => (
            <CautionBox key={c.id} title={c.title}>
              <p>{c.text}</p>
            </CautionBox>
          ))}
        </div>
      </Card>
    </article>
  );
}
