/**
 * The spray-record export as a PDF (US Letter, landscape): one row per product applied with the
 * 7 CFR Part 110 fields and the weather, and the label-is-the-law caution. Rendered in the PDF pool.
 */
import type { Content, TableCell } from 'pdfmake/interfaces';
import { SPRAY_RECORD_CAUTION } from '../../../shared/domain/spray-records';
import { formatDate } from '../../../shared/domain/clock';
import { formatLatLon } from '../../../shared/domain/geometry';
import type { SprayRecordDto } from '../../../shared/schemas/spray-records';
import { cautionBox, pageFrame, renderPdf, ruledTableLayout } from './pdf';

export interface SprayRecordsPdfInput {
  firmName: string;
  season: number;
  /** "All properties" or the property's name. */
  scope: string;
  preparedOn: string;
  records: readonly SprayRecordDto[];
}

const cell = (text: string, style = 'tableCell'): TableCell => ({ text, style });
const num = (value: number) => value.toLocaleString('en-US', { maximumFractionDigits: 3 });

/** Renders the season's spray records to PDF bytes. */
export async function renderSprayRecordsPdf(input: SprayRecordsPdfInput): Promise<Buffer> {
  const header = ['Date', 'Location', 'Crop or site', 'Area', 'Product · EPA Reg. No.', 'Total applied', 'Applicator · Cert. No.', 'Weather'].map((h) => cell(h, 'tableHeader'));
  const body: TableCell[][] = [header];
  for (const r of input.records) {
    body.push([
      cell(formatDate(r.appliedOn)),
      { stack: [{ text: `${r.propertyName} · ${r.unitName}`, style: 'tableCell' }, { text: r.latitude !== null && r.longitude !== null ? formatLatLon(r.longitude, r.latitude) : 'no outline', style: 'small' }] },
      cell(r.cropOrSite),
      cell(`${num(r.areaTreated)} ${r.areaUnit}`),
      { stack: [{ text: r.productName, style: 'tableCell' }, { text: `EPA Reg. No. ${r.epaRegNo ?? 'not recorded'}${r.restrictedUse ? ' · RESTRICTED USE' : ''}`, style: 'small' }] },
      cell(`${num(r.amount)} ${r.amountUnit}`),
      { stack: [{ text: r.applicatorName, style: 'tableCell' }, { text: r.applicatorCertNo ? `Cert. No. ${r.applicatorCertNo}` : 'not certified', style: 'small' }] },
      cell(`Wind ${num(r.windMph)} mph from ${r.windDirection}, ${num(r.airTempF)} °F`),
    ]);
  }
  const content: Content[] = [
    { text: `Spray records, ${input.season}`, style: 'title' },
    { text: `${input.scope} · ${input.records.length} ${input.records.length === 1 ? 'application' : 'applications'} · records under 7 CFR Part 110`, style: 'subtitle' },
    input.records.length === 0
      ? { text: 'No herbicide applications were recorded in this season.', style: 'muted' }
      : { table: { headerRows: 1, dontBreakRows: true, widths: [58, '*', 80, 48, '*', 60, 90, 90], body }, layout: ruledTableLayout },
    cautionBox('The label is the law', [SPRAY_RECORD_CAUTION]),
  ];
  return renderPdf({ pageSize: 'LETTER', pageOrientation: 'landscape', ...pageFrame({ title: `Spray records ${input.season}`, firmName: input.firmName, preparedOn: input.preparedOn }), content });
}
