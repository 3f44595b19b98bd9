import { execFileSync } from 'node:child_process';
import { writeFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { type SeasonReportDocumentInput } from '../../../templates/documents/season-report';
import { renderSeasonReportPdf } from '../../../server/services/documents/render-documents';
import { onlyAHarvest } from '../../support/season-report-fixtures';
import { browseResult, establishmentResult, timberResult } from '../../../shared/domain/plot-checks';
import { limeRecommendation, nutrientRecommendation } from '../../../shared/domain/soil-tests';
import { seasonChecksSection } from '../../../templates/documents/season-report-checks';

/** Invented demo content: a thin brassica plot, a browsed clover plot, an oak stand cruised, one soil test. */
function withChecks(): SeasonReportDocumentInput {
  const stand = establishmentResult({ frameSqFt: 1, samples: [{ species: 'rape', plants: 3 }, { species: 'turnip', plants: 2 }, { species: 'wheat', plants: 21 }], groundCoverPct: 45, weedPressure: 'moderate' });
  const browse = browseResult([{ species: 'white clover', caged: 9, open: 3 }, { species: 'forage chicory', caged: 14, open: 11 }]);
  const cruise = timberResult({ baf: 10, points: [{ inTrees: 11 }, { inTrees: 13 }, { inTrees: 9 }], targetResidualBaSqFtPerAcre: 70 });
  const lime = limeRecommendation('missouri', { ph: 5.6, enmLbPerAcre: 900 }, 6.5);
  const nutrients = nutrientRecommendation({ ph: 5.6, pPpm: 18, kPpm: 120 }, 'legume');
  return {
    ...onlyAHarvest(),
    checks: {
      establishment: [{ unitName: 'Hollow brassica plot', checkedOn: '2025-09-24', status: stand.status, groundCoverPct: 45, species: stand.species }],
      browse: [{ unitName: 'Ridge clover plot', checkedOn: '2025-10-20', overallUsePct: browse.overallUsePct, species: browse.species }],
      timber: [{ unitName: 'North oak slope', checkedOn: '2025-11-08', basalAreaSqFtPerAcre: cruise.basalAreaSqFtPerAcre, targetResidualBaSqFtPerAcre: 70, treesPerAcre: cruise.treesPerAcre }],
      soilTests: [{ unitName: 'Ridge clover plot', sampledOn: '2025-03-18', lab: 'Driftless Soil Lab', ph: 5.6, pPpm: 18, kPpm: 120, limeTonsPerAcre: lime.tonsPerAcre, p2o5LbPerAcre: nutrients.p2o5LbPerAcre, k2oLbPerAcre: nutrients.k2oLbPerAcre, limeSource: lime.source, nutrientSource: nutrients.source }],
    },
  };
}

describe('the season report prints the checks and the soil tests', () => {
  it('shows each plot’s stand against its cited target, browse use with Jacobs’ D, basal area against target and the soil tests', async () => {
    const pdf = await renderSeasonReportPdf(withChecks());
    if (process.env.SEASON_REPORT_PDF_OUT) writeFileSync(process.env.SEASON_REPORT_PDF_OUT, pdf);
    const text = execFileSync('pdftotext', ['-layout', '-', '-'], { input: pdf }).toString();
    const flat = text.replace(/\s+/g, ' ');
    expect(text).toContain('Checks on the plots and the soil');
    // rape 3/ft² against 5 (OMAFRA canola guide); wheat 21 against 20 (Penn State); turnip 2 against 5 (from memory)
    expect(text).toMatch(/rape\s+3\.0\s+5/);
    expect(text).toMatch(/wheat\s+21\.0\s+20/);
    expect(flat).toContain('Thin · 45 % cover'); // mean of min(1, r): (0.6 + 0.4 + 1) ÷ 3 = 0.67 → thin (thresholds common practice, no source)
    expect(flat).toMatch(/wheat: Penn State Extension, "Wheat Stand Assessment"/);
    // Clover: (9 − 3) ÷ 9 = 67 % use; chicory (14 − 11) ÷ 14 = 21 %; all species (23 − 14) ÷ 23 = 39 %
    expect(text).toMatch(/white clover\s+67 %/);
    expect(text).toMatch(/forage chicory\s+21 %/);
    expect(text).toContain("Jacobs' D");
    // r = 6/9 = 0.667 of use, p = 9/23 = 0.391 available → D = (0.667 − 0.391) ÷ (0.667 + 0.391 − 2 × 0.261) = 0.51 (Jacobs 1974)
    expect(text).toMatch(/white clover\s+67 %\s+0\.51/);
    // BAF 10 × mean 11 in-trees = 110 ft²/acre against 70: thin 40 (standard prism cruise)
    expect(text).toMatch(/North oak slope\s+Nov 8, 2025\s+110\s+70/);
    expect(flat).toContain('Thin 40 ft²/acre');
    // 900 lb ENM ÷ 400 per ton = 2.25 t/acre (University of Missouri); P (25 − 18) × 20 ÷ 4 + 30 = 65 (Tri-State); K 120 ≥ 105 ppm, the critical level without a CEC (2020 Tri-State ÷ 1.14, Ohio State ANR-75): maintenance 60 (from memory)
    expect(text).toMatch(/Ridge clover plot\s+Mar 18, 2025\s+5\.6\s+18\s+120\s+2\.25\s+65\s+60/);
    expect(flat).toMatch(/Worked by: University of Missouri .*Tri-State/);
  });

  it('prints no section at all for a season without checks or soil tests', () => {
    expect(seasonChecksSection(undefined)).toEqual([]);
    expect(seasonChecksSection({ establishment: [], browse: [], timber: [], soilTests: [] })).toEqual([]);
  });
});
