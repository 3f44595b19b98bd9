import type { SurveyTrendPoint } from '../../../../shared/schemas/results';
import { Card } from '../../../components/ui/card';
import { SurveyRatioChart, SurveyTrendChart } from './lazy-results-charts';

/** The camera surveys season over season (estimates and ratios), when there are any. */
export function SurveyTrendCard({ trend }: { trend: readonly SurveyTrendPoint[] }) {
  if (trend.length === 0) return null;
  return (
    <Card title="Season over season">
      <div className="grid gap-6 md:grid-cols-2">
        <SurveyTrendChart trend={trend} />
        <SurveyRatioChart trend={trend} />
      </div>
    </Card>
  );
}
