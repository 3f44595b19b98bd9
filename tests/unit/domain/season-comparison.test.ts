import { describe, expect, it } from 'vitest';
import { checkOutcomeText, compareSeasons, pickSeasons, seasonCell, type SeasonUnitRecord } from '../../../shared/domain/season-comparison';

const rec = (over: Partial<SeasonUnitRecord>): SeasonUnitRecord => ({ unitId: 1, unitName: 'Ridge clover plot', kind: 'food-plot', acres: 1.2, season: 2026, checks: [], soilTests: [], tasks: [], ...over });

describe('season comparison', () => {
  it('reads each check in one plain sentence', () => {
    expect(checkOutcomeText({ kind: 'establishment', checkedOn: '2026-09-20', status: 'thin', result: {} })).toBe('Thin stand (Sep 20, 2026)');
    // use % over all pairs (caged − open) ÷ caged, as plot-checks computes it; rounded for the landowner
    expect(checkOutcomeText({ kind: 'browse', checkedOn: '2026-10-20', status: 'browsed-hard', result: { overallUsePct: 57.6 } })).toBe('Deer ate 58 % of the forage (Oct 20, 2026)');
    expect(checkOutcomeText({ kind: 'timber', checkedOn: '2026-11-08', status: 'over-target', result: { basalAreaSqFtPerAcre: 110, targetResidualBaSqFtPerAcre: 70 } })).toBe('Basal area 110 ft²/acre against a target of 70 (Nov 8, 2026)');
  });

  it('takes the latest check and soil test of a season, and counts work done against work not skipped', () => {
    const cell = seasonCell(
      rec({
        checks: [
          { kind: 'browse', checkedOn: '2026-10-20', status: 'checked', result: { overallUsePct: 20 } },
          { kind: 'establishment', checkedOn: '2026-09-20', status: 'established', result: {} },
        ],
        soilTests: [{ sampledOn: '2026-08-01', ph: 6.2 }, { sampledOn: '2026-03-01', ph: 5.6 }],
        tasks: [{ name: 'Lime', status: 'done' }, { name: 'Seed', status: 'done' }, { name: 'Mow', status: 'skipped' }, { name: 'Spray', status: 'planned' }],
      }),
    );
    expect(cell.status).toBe('checked');
    expect(cell.checks[0]).toMatch(/^Established/);
    expect(cell.soilPh).toBe(6.2);
    expect(cell).toMatchObject({ tasksDone: 2, tasksTotal: 3, workDone: ['Lime', 'Seed'] });
  });

  it('pairs units across the two seasons, with the pH change when both have a test', () => {
    const c = compareSeasons(
      [
        rec({ season: 2025, soilTests: [{ sampledOn: '2025-03-01', ph: 5.4 }] }),
        rec({ season: 2026, soilTests: [{ sampledOn: '2026-03-01', ph: 6.1 }] }),
        rec({ unitId: 2, unitName: 'Hollow brassica plot', season: 2024, soilTests: [{ sampledOn: '2024-03-01', ph: 5 }] }),
        rec({ unitId: 3, unitName: 'Alder bottom', season: 2026 }),
      ],
      2026,
      2025,
    );
    expect(c.rows.map((r) => r.unitName)).toEqual(['Alder bottom', 'Ridge clover plot']); // 2024 only: left out
    expect(c.rows[1]!.phChange).toBe(0.7);
    expect(c.rows[0]!.phChange).toBeNull();
    expect(c.rows[0]!.previous).toMatchObject({ status: null, soilPh: null, tasksDone: 0 });
  });

  it('shows the season asked for, else the latest recorded, else this year', () => {
    expect(pickSeasons([2024, 2026, 2025], null, 2027)).toEqual({ season: 2026, previousSeason: 2025 });
    expect(pickSeasons([2024, 2026], 2024, 2027)).toEqual({ season: 2024, previousSeason: 2023 });
    expect(pickSeasons([], null, 2027)).toEqual({ season: 2027, previousSeason: 2026 });
  });
});
