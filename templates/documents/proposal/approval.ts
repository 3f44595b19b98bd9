/**
 * How to approve, or the approval record with its content hash.
 */
import { DOC_COLORS, FONT_HEADING } from '../kit/layout';
import type { Content } from 'pdfmake/interfaces';
import { formatSignedAt } from './format';
import type { DocData } from './input';
import { MOSS_TINT, OCHRE, OCHRE_TINT } from './look';

/** How to approve (or, once approved, the approval record with its content hash). */
export function approvalSection(data: DocData, money: (c: number) => string): Content {
  const { approval, proposal, firm } = data;
  let body: Content[];
  let color: string = DOC_COLORS.moss;
  let tint: string = MOSS_TINT;
  if (approval) {
    body = [
      { text: 'Approved', font: FONT_HEADING, bold: true, fontSize: 11, color: DOC_COLORS.mossDeep, margin: [0, 0, 0, 4] },
      { text: [{ text: 'Approved by ' }, { text: approval.signedName, bold: true }, { text: ` on ${formatSignedAt(approval.signedAt, data.timeZone)}.` }] },
      {
        text: `The approval covers version ${proposal.version} exactly as printed: its lines, prices, options, discount, sales tax, deposit and terms. Approval fingerprint (a code computed from all of that; any change would change it):`,
        style: 'small',
        margin: [0, 4, 0, 2],
      },
      { text: approval.contentHash.toLowerCase(), fontSize: 8, characterSpacing: 0.5, fontFeatures: ['tnum'], color: DOC_COLORS.ink },
    ];
  } else if (proposal.status === 'sent') {
    const deposit = data.totals.depositCents > 0 ? ` The deposit of ${money(data.totals.depositCents)} is due on approval.` : '';
    body = [
      { text: 'How to approve', font: FONT_HEADING, bold: true, fontSize: 11, color: DOC_COLORS.mossDeep, margin: [0, 0, 0, 4] },
      {
        text: `Approve online in your portal: open proposal ${proposal.number}, read it through, and type your name to approve it.${deposit}`,
      },
      {
        text: `Questions or changes? Contact ${[firm.name, firm.phone, firm.email].filter(Boolean).join(' · ')}.`,
        style: 'small',
        margin: [0, 4, 0, 0],
      },
    ];
  } else if (proposal.status === 'draft') {
    body = [
      { text: 'How to approve', font: FONT_HEADING, bold: true, fontSize: 11, color: DOC_COLORS.mossDeep, margin: [0, 0, 0, 4] },
      { text: 'Once this proposal is sent, the client approves it online in the portal by typing their name.' },
    ];
    color = OCHRE;
    tint = OCHRE_TINT;
  } else {
    body = [
      { text: 'Approval', font: FONT_HEADING, bold: true, fontSize: 11, color: DOC_COLORS.ink, margin: [0, 0, 0, 4] },
      { text: `This version can no longer be approved online. Ask ${firm.name} for a current version.` },
    ];
    color = DOC_COLORS.slate;
    tint = DOC_COLORS.card;
  }
  return {
    unbreakable: true,
    margin: [0, 16, 0, 0],
    table: { widths: ['*'], body: [[{ stack: body, fillColor: tint }]] },
    layout: {
      hLineWidth: () => 1,
      vLineWidth: () => 1,
      hLineColor: () => color,
      vLineColor: () => color,
      paddingLeft: () => 12,
      paddingRight: () => 12,
      paddingTop: () => 9,
      paddingBottom: () => 9,
    },
  };
}
