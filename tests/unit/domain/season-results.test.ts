import { describe, expect, it } from 'vitest';
import { acresEstablished, deerSexOf, seasonRange, surveyTrend } from '../../../shared/domain/season-results';
import { cameraSurveyEstimates } from '../../../shared/domain/survey-estimates';
import { DomainValidationError } from '../../../shared/domain/errors';

describe('seasonRange', () => {
  it('runs July through June and is named by the year it starts', () => {
    // July–June hunting season: our convention (the same as huntingSeasonOf), no source.
    expect(seasonRange(2025)).toEqual({ season: 2025, label: '2025–26', startsOn: '2025-07-01', endsOn: '2026-06-30' });
    expect(seasonRange(1999).label).toBe('1999–00');
    expect(() => seasonRange(2025.5)).toThrow(DomainValidationError);
  });
});

describe('deerSexOf', () => {
  it('maps the API’s male/female onto the summary’s buck/doe', () => {
    expect(deerSexOf('male')).toBe('buck'); // common practice, no source
    expect(deerSexOf('female')).toBe('doe');
  });
});

describe('acresEstablished', () => {
  // Invented plan: three plots and a camera site.
  const units = [
    { id: 1, acres: 2.5 },
    { id: 2, acres: 1.25 },
    { id: 3, acres: 4 },
    { id: 4, acres: null },
  ];
  const t = (unitId: number | null, status: 'planned' | 'done' | 'skipped', doneOn: string | null) => ({ unitId, status, doneOn, costCents: 100 });

  it('counts units whose every task is done or skipped, finished within the season', () => {
    const tasks = [
      t(1, 'done', '2025-08-01'),
      t(1, 'done', '2025-09-10'), // unit 1: all done in 2025–26
      t(2, 'done', '2025-08-05'),
      t(2, 'planned', null), // unit 2: still open
      t(3, 'done', '2025-06-20'), // unit 3: finished in the 2024–25 season
      t(4, 'done', '2025-08-01'), // unit 4: a point, no acres
      t(null, 'done', '2025-08-01'),
    ];
    // Added by hand: only unit 1 (2.5 acres) and unit 4 (no area) qualify for 2025.
    expect(acresEstablished(units, tasks, 2025)).toEqual({ unitIds: [1, 4], acres: 2.5 });
    expect(acresEstablished(units, tasks, 2024)).toEqual({ unitIds: [3], acres: 4 });
  });

  it('leaves out a unit whose tasks were all skipped, and counts one with a skipped step', () => {
    const tasks = [t(1, 'skipped', null), t(2, 'done', '2025-10-01'), t(2, 'skipped', null)];
    expect(acresEstablished(units, tasks, 2025)).toEqual({ unitIds: [2], acres: 1.25 });
  });
});

describe('surveyTrend', () => {
  const est = (buckPhotos: number, uniqueBucks: number, doePhotos: number, fawnPhotos: number) =>
    cameraSurveyEstimates({ buckPhotos, uniqueBucks, doePhotos, fawnPhotos, propertyAcres: 640, cameraCount: 7, startDate: '2024-08-01', endDate: '2024-08-14' }).estimates;

  it('keeps the latest survey of each season, oldest season first', () => {
    const rows = surveyTrend([
      { id: 3, name: 'Late 2025', startDate: '2025-08-20', endDate: '2025-09-02', estimates: est(30, 10, 40, 20) },
      { id: 1, name: 'Early 2024', startDate: '2024-07-10', endDate: '2024-07-24', estimates: est(20, 10, 30, 10) },
      { id: 2, name: 'Late 2024', startDate: '2024-08-20', endDate: '2024-09-02', estimates: est(20, 10, 50, 10) },
      { id: 4, name: 'No area', startDate: '2023-08-20', endDate: '2023-09-02', estimates: null },
    ]);
    expect(rows.map((r) => [r.label, r.surveyName])).toEqual([
      ['2024–25', 'Late 2024'],
      ['2025–26', 'Late 2025'],
    ]);
    // Worked by hand: 20 ÷ 10 = 2 photos per buck; 50 ÷ 2 = 25 does; 10 ÷ 2 = 5 fawns; 40 deer on 1 mi².
    expect(rows[0]).toMatchObject({ bucks: 10, does: 25, fawns: 5, total: 40, deerPerSqMi: 40, buckDoeRatio: 2.5, fawnDoeRatio: 0.2 });
  });
});
