import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { type SeasonReportDocumentInput } from '../../../templates/documents/season-report';
import { renderSeasonReportPdf } from '../../../server/services/documents/render-documents';
import { onlyAHarvest } from '../../support/season-report-fixtures';
import { emptySeasonReason, establishedText, hasBars } from '../../../shared/domain/season-results';

describe('the season report says what there is', () => {
  it('never prints "0.00 acre established": with no unit finished it says so in words', async () => {
    const text = execFileSync('pdftotext', ['-layout', '-', '-'], { input: await renderSeasonReportPdf(onlyAHarvest()) }).toString();
    expect(text).not.toMatch(/0\.00 acres?/);
    expect(text.replace(/\s+/g, ' ')).toContain('No unit has all of its work finished yet, so no acres are counted as established.');
    expect(text).toContain('1 deer taken');
    expect(text).toContain('No camera survey was recorded this season.');
  });

  it('draws no chart of zeros, and refuses a season with nothing at all', () => {
    expect(hasBars([{ values: [0, 0, null] }])).toBe(false);
    expect(hasBars([{ values: [0, 1.4] }])).toBe(true);
    expect(emptySeasonReason({ work: 0, surveys: 0, harvests: 0 }, '2019–20')).toMatch(/^There is nothing to report for the 2019–20 season yet/);
    expect(emptySeasonReason({ work: 0, surveys: 0, harvests: 1 }, '2025–26')).toBeNull();
    expect(establishedText(0, [], 2)).toBe('2 tasks were finished this season; no unit has all of its work finished yet, so no acres are counted as established.');
    expect(establishedText(2.37, [{ name: 'Hollow plot', acresText: '2.37 acres' }], 2)).toBe('established this season: Hollow plot (2.37 acres).');
  });

  it('prints a section on field observations: the total, by kind, by unit, and a chart by month', async () => {
    const input: SeasonReportDocumentInput = {
      ...onlyAHarvest(),
      observations: {
        total: 5,
        byKind: [{ label: 'Scrape', count: 3 }, { label: 'Rub', count: 2 }],
        byUnit: [{ label: 'Ridge plot', count: 4 }, { label: 'Outside every unit', count: 1 }],
        byMonth: [{ label: 'Oct 2025', count: 2 }, { label: 'Nov 2025', count: 3 }],
      },
    };
    const text = execFileSync('pdftotext', ['-layout', '-', '-'], { input: await renderSeasonReportPdf(input) }).toString();
    expect(text).toContain('Sign on the ground');
    expect(text).toContain('5 observations were logged on the property this season.');
    expect(text).toMatch(/Scrape\s+3/);
    expect(text).toMatch(/Ridge plot\s+4/);
    expect(text).toContain('Observations by month');
  });
});
