/**
 * The proposal's pdfmake document definition, put together from its sections.
 */
import { formatLatLon } from '../../../shared/domain/geometry';
import { formatCents } from '../../../shared/domain/money';
import { DOC_COLORS, keepWithNextRule, pageFrame } from '../kit/layout';
import { renderPlanMap } from '../kit/map-svg';
import type { ProposalDocumentInput } from '../proposal-input';
import type { Content, TDocumentDefinitions } from 'pdfmake/interfaces';
import { approvalSection } from './approval';
import { formatCalendarDate, formatSignedAt, paragraphs, unitsOf } from './format';
import { headline, letterhead, mapPlacement } from './header';
import { parseInput } from './input';
import { CONTENT_WIDTH_PT, GROUP_ROW_ID, GROUP_ROW_KEEP_PT, MOSS_TINT } from './look';
import { banner, statusLook, watermarkFor } from './status';
import { cautionsSection, termsSection } from './terms';
import { priceSection } from './totals';
import { workSection } from './work';

/**
 * Page-break rule of the proposal: headings stay with what follows (the shared rule), and a unit's
 * header row in the price table moves to the next page unless one line row fits below it.
 */
export const proposalPageBreakBefore = keepWithNextRule({ idPrefix: GROUP_ROW_ID, keepPt: GROUP_ROW_KEEP_PT });

/** The pdfmake document definition of a proposal (build a fresh one for every render). */
export function proposalDocument(input: ProposalDocumentInput): TDocumentDefinitions {
  const data = parseInput(input);
  const { firm, proposal, property } = data;
  const money = (c: number) => formatCents(c, proposal.currency);
  const preparedOn = formatCalendarDate(proposal.preparedOn, 'proposal.preparedOn');
  const validUntil = proposal.expiresOn ? formatCalendarDate(proposal.expiresOn, 'proposal.expiresOn') : null;
  const look = statusLook(proposal.status, firm.name, validUntil);
  const approvedLook =
    proposal.status === 'approved' && data.approval
      ? {
          headline: `APPROVED — by ${data.approval.signedName} on ${formatSignedAt(data.approval.signedAt, data.timeZone)}`,
          detail: 'The approval record is at the end of this proposal.',
          color: DOC_COLORS.moss,
          tint: MOSS_TINT,
        }
      : null;
  const bannerLook = look ?? approvedLook;

  const placement = mapPlacement(data, bannerLook !== null);
  const map = renderPlanMap({
    boundary: property.boundary,
    units: data.units.map((u) => ({ name: u.name, kind: u.kind, geometry: u.geometry })),
    overlays: data.overlays,
    widthPt: CONTENT_WIDTH_PT,
    heightPt: placement.heightPt,
  });
  const centre = map.layout.projection;
  const locality = property.locality?.trim() || `Near ${formatLatLon(centre.lon0, centre.lat0)}`;
  const intro = proposal.introduction?.trim() ? paragraphs(proposal.introduction) : [];
  const mapBlock: Content = {
    unbreakable: true,
    stack: [
      { svg: map.svg, width: CONTENT_WIDTH_PT },
      { text: 'Positions are approximate; the map is not a survey.', style: 'small', margin: [0, 4, 0, 0] },
    ],
  };

  const content: Content[] = [
    letterhead(data, preparedOn, validUntil),
    ...(bannerLook ? [banner(bannerLook)] : []),
    headline(data, locality, preparedOn, validUntil),
    ...(intro.length > 0 ? [{ stack: intro, margin: [0, 0, 0, 12] } as Content] : []),
    ...(placement.onPage1 ? [mapBlock] : []),
    ...workSection(data.groups, unitsOf(data)),
    ...(placement.onPage1 ? [] : [{ ...mapBlock, margin: [0, 8, 0, 0] } as Content]),
    ...priceSection(data, money),
    ...termsSection(proposal.terms),
    cautionsSection(data.cautions),
    approvalSection(data, money),
  ];

  const frame = pageFrame({
    title: `Proposal ${proposal.number} · version ${proposal.version}${look ? ` · ${look.word}` : ''}`,
    firmName: firm.name,
    firmContact: [firm.phone, firm.email].filter(Boolean).join(' · ') || undefined,
    preparedOn,
    // Page 1 carries its own letterhead; the running header starts on page 2.
    headerFromPage: 2,
  });
  return {
    ...frame,
    watermark: watermarkFor(look),
    pageBreakBefore: proposalPageBreakBefore,
    info: {
      title: `Proposal ${proposal.number} (version ${proposal.version}) — ${proposal.title}`,
      author: firm.name,
      subject: `Proposal for ${data.client.name}, ${property.name}`,
    },
    content,
  };
}
