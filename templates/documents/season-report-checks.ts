/**
 * The season report's checks and soil tests: how each seeded plot came up against its target stand
 * (with the guide each target comes from), how hard deer used the plots (use % and Jacobs' D per
 * species), timber basal area against the prescription's target, and the soil tests on file with
 * the lime and fertilizer they call for. Figures are printed as shared/domain computed them.
 */
import type { Content, TableCell } from 'pdfmake/interfaces';
import type { EstablishmentStatus } from '../../shared/domain/plot-checks';
import { formatDate } from '../../shared/domain/clock';
import { DOC_COLORS, ruledTableLayout } from './kit/layout';

export interface SeasonReportChecks {
  establishment: {
    unitName: string;
    checkedOn: string;
    status: EstablishmentStatus;
    groundCoverPct: number;
    species: { species: string; plantsPerSqFt: number; targetPlantsPerSqFt: number | null; targetSource: string | null }[];
  }[];
  browse: { unitName: string; checkedOn: string; overallUsePct: number; species: { species: string; usePct: number; jacobsD: number | null }[] }[];
  timber: { unitName: string; checkedOn: string; basalAreaSqFtPerAcre: number; targetResidualBaSqFtPerAcre: number | null; treesPerAcre: number | null }[];
  /** The latest soil test of each unit on file at the season's end. */
  soilTests: {
    unitName: string;
    sampledOn: string;
    lab: string;
    ph: number;
    pPpm: number | null;
    kPpm: number | null;
    limeTonsPerAcre: number;
    p2o5LbPerAcre: number;
    k2oLbPerAcre: number;
    limeSource: string;
    nutrientSource: string;
  }[];
}

const STATUS_TEXT: Record<EstablishmentStatus, string> = { established: 'Established', thin: 'Thin', failed: 'Failed' };
const STATUS_COLOR: Record<EstablishmentStatus, string> = { established: DOC_COLORS.mossDeep, thin: '#8A6A1E', failed: DOC_COLORS.clay };

const fixed = (n: number, digits: number) => n.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits });
const orDash = (n: number | null, digits: number) => (n === null ? '—' : fixed(n, digits));

function table(header: string[], rows: (string | TableCell)[][], widths: (string | number)[], numeric: number[] = []): Content {
  const cell = (c: string | TableCell, i: number): TableCell => (typeof c === 'string' ? { text: c, style: 'tableCell', alignment: numeric.includes(i) ? 'right' : 'left' } : c);
  return {
    table: {
      headerRows: 1,
      widths,
      dontBreakRows: true,
      body: [header.map((h, i) => ({ text: h, style: 'tableHeader', alignment: numeric.includes(i) ? 'right' : 'left' }) as TableCell), ...rows.map((r) => r.map(cell))],
    },
    layout: ruledTableLayout,
    margin: [0, 0, 0, 6],
  } as Content;
}

function establishmentPart(checks: SeasonReportChecks['establishment']): Content[] {
  if (checks.length === 0) return [];
  const rows: TableCell[][] = [];
  for (const c of checks) {
    c.species.forEach((s, i) => {
      rows.push([
        { text: i === 0 ? c.unitName : '', style: 'tableCell' },
        { text: i === 0 ? formatDate(c.checkedOn) : '', style: 'tableCell' },
        { text: s.species, style: 'tableCell' },
        { text: fixed(s.plantsPerSqFt, 1), style: 'tableCell', alignment: 'right' },
        { text: orDash(s.targetPlantsPerSqFt, 0), style: 'tableCell', alignment: 'right' },
        i === 0 ? { text: `${STATUS_TEXT[c.status]} · ${c.groundCoverPct} % cover`, style: 'tableCell', bold: true, color: STATUS_COLOR[c.status] } : { text: '', style: 'tableCell' },
      ]);
    });
  }
  const sources = [...new Set(checks.flatMap((c) => c.species.flatMap((s) => (s.targetSource && s.targetPlantsPerSqFt !== null ? [`${s.species}: ${s.targetSource}`] : []))))];
  return [
    { text: 'How the plots came up', style: 'h3' },
    table(['Plot', 'Checked', 'Species', 'Plants/ft²', 'Target', 'Stand'], rows, ['*', 58, 80, 50, 40, 110], [3, 4]),
    ...(sources.length ? [{ text: 'Where each target stand comes from', style: 'small', bold: true } as Content, { ul: sources, style: 'small', margin: [0, 2, 0, 6] } as Content] : []),
  ];
}

function browsePart(checks: SeasonReportChecks['browse']): Content[] {
  if (checks.length === 0) return [];
  const rows: string[][] = checks.flatMap((c) => c.species.map((s, i) => [i === 0 ? c.unitName : '', i === 0 ? formatDate(c.checkedOn) : '', s.species, `${Math.round(s.usePct)} %`, s.jacobsD === null ? '—' : fixed(s.jacobsD, 2), i === 0 ? `${Math.round(c.overallUsePct)} %` : '']));
  return [
    { text: 'How hard deer used the plots', style: 'h3' },
    table(['Plot', 'Checked', 'Species', 'Use', "Jacobs' D", 'All species'], rows, ['*', 58, 90, 40, 50, 62], [3, 4, 5]),
    {
      text: "Use = (caged − open) ÷ caged, from exclusion cages beside open samples. Jacobs' D (Jacobs 1974) runs from −1 (avoided) through 0 (eaten as available) to +1 (preferred).",
      style: 'small',
      margin: [0, 0, 0, 6],
    },
  ];
}

function timberPart(checks: SeasonReportChecks['timber']): Content[] {
  if (checks.length === 0) return [];
  const rows = checks.map((c) => {
    const over = c.targetResidualBaSqFtPerAcre !== null && c.basalAreaSqFtPerAcre > c.targetResidualBaSqFtPerAcre;
    return [
      c.unitName,
      formatDate(c.checkedOn),
      fixed(c.basalAreaSqFtPerAcre, 0),
      orDash(c.targetResidualBaSqFtPerAcre, 0),
      orDash(c.treesPerAcre, 0),
      { text: c.targetResidualBaSqFtPerAcre === null ? 'No target set' : over ? `Thin ${fixed(c.basalAreaSqFtPerAcre - c.targetResidualBaSqFtPerAcre, 0)} ft²/acre` : 'At or under target', style: 'tableCell', color: over ? DOC_COLORS.clay : DOC_COLORS.ink } as TableCell,
    ];
  });
  return [
    { text: 'Timber: basal area against target', style: 'h3' },
    table(['Stand', 'Cruised', 'BA ft²/acre', 'Target', 'Trees/acre', 'Next'], rows, ['*', 58, 70, 44, 50, 100], [2, 3, 4]),
  ];
}

function soilPart(tests: SeasonReportChecks['soilTests']): Content[] {
  if (tests.length === 0) return [];
  const rows = tests.map((t) => [t.unitName, formatDate(t.sampledOn), fixed(t.ph, 1), orDash(t.pPpm, 0), orDash(t.kPpm, 0), fixed(t.limeTonsPerAcre, 2), `${t.p2o5LbPerAcre}`, `${t.k2oLbPerAcre}`]);
  const sources = [...new Set(tests.flatMap((t) => [t.limeSource, t.nutrientSource]))];
  return [
    { text: 'Soil tests on file', style: 'h3' },
    table(['Plot', 'Sampled', 'pH', 'P ppm', 'K ppm', 'Lime t/acre', 'P2O5 lb/acre', 'K2O lb/acre'], rows, ['*', 58, 30, 36, 36, 46, 52, 50], [2, 3, 4, 5, 6, 7]),
    { text: `Worked by: ${sources.join(' · ')}.`, style: 'small', margin: [0, 0, 0, 6] },
  ];
}

/** The checks and soil tests section; nothing at all when the season has neither. */
export function seasonChecksSection(checks: SeasonReportChecks | undefined): Content[] {
  if (!checks) return [];
  const parts = [...establishmentPart(checks.establishment), ...browsePart(checks.browse), ...timberPart(checks.timber), ...soilPart(checks.soilTests)];
  if (parts.length === 0) return [];
  return [{ text: 'Checks on the plots and the soil', style: 'h2' }, ...parts];
}
