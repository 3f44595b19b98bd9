/**
 * The results charts (recharts) as their own chunk: the Results pages show their figures and tables
 * first, and the charts once their code has arrived.
 */
import { lazy, Suspense, type ComponentType } from 'react';
import type * as Charts from './results-charts';

const load = () => import('./results-charts');

function deferred<P extends object>(pick: (m: typeof Charts) => ComponentType<P>) {
  const Lazy = lazy(async () => ({ default: pick(await load()) })) as unknown as ComponentType<P>;
  return function DeferredChart(props: P) {
    return (
      <Suspense fallback={<div className="h-56 animate-pulse rounded-md bg-rule/40" aria-label="Loading the chart…" />}>
        <Lazy {...props} />
      </Suspense>
    );
  };
}

export const SurveyTrendChart = deferred((m) => m.SurveyTrendChart);
export const SurveyRatioChart = deferred((m) => m.SurveyRatioChart);
export const AgeStructureChart = deferred((m) => m.AgeStructureChart);
export const BuckDoeTrendChart = deferred((m) => m.BuckDoeTrendChart);
