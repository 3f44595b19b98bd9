/**
 * How a proposal's status shows: the banner and the watermark of drafts and proposals that can no longer be approved.
 */
import { DOC_COLORS, FONT_HEADING } from '../kit/layout';
import type { Content, Watermark } from 'pdfmake/interfaces';
import type { Status } from './input';
import { OCHRE, OCHRE_TINT } from './look';

interface StatusLook {
  word: string;
  headline: string;
  detail: string;
  color: string;
  tint: string;
}

/** The banner, watermark and header word of a status (null for sent and approved proposals: they carry none of these). */
export function statusLook(status: Status, firmName: string, validUntil: string | null): StatusLook | null {
  switch (status) {
    case 'draft':
      return {
        word: 'DRAFT',
        headline: 'DRAFT — not yet sent',
        detail: 'Prices and terms may still change; this copy cannot be approved.',
        color: OCHRE,
        tint: OCHRE_TINT,
      };
    case 'declined':
      return {
        word: 'DECLINED',
        headline: 'DECLINED — this proposal was declined',
        detail: `It can no longer be approved. Ask ${firmName} for a revised version.`,
        color: DOC_COLORS.clay,
        tint: DOC_COLORS.clayTint,
      };
    case 'withdrawn':
      return {
        word: 'WITHDRAWN',
        headline: `WITHDRAWN — ${firmName} withdrew this proposal`,
        detail: 'It can no longer be approved; a newer version may replace it.',
        color: DOC_COLORS.clay,
        tint: DOC_COLORS.clayTint,
      };
    case 'expired':
      return {
        word: 'EXPIRED',
        headline: validUntil ? `EXPIRED — this proposal was valid until ${validUntil}` : 'EXPIRED — this proposal is no longer valid',
        detail: `Prices may have changed. Ask ${firmName} for a current version.`,
        color: DOC_COLORS.clay,
        tint: DOC_COLORS.clayTint,
      };
    default:
      return null;
  }
}

/** The coloured banner under the letterhead. */
export function banner(look: { headline: string; detail: string; color: string; tint: string }): Content {
  return {
    margin: [0, 0, 0, 12],
    table: {
      widths: ['*'],
      body: [
        [
          {
            fillColor: look.tint,
            stack: [
              { text: look.headline, font: FONT_HEADING, bold: true, fontSize: 10.5, color: DOC_COLORS.ink },
              { text: look.detail, fontSize: 9, color: DOC_COLORS.ink, margin: [0, 2, 0, 0] },
            ],
          },
        ],
      ],
    },
    layout: {
      hLineWidth: () => 0,
      vLineWidth: (i) => (i === 0 ? 4 : 0),
      vLineColor: () => look.color,
      paddingLeft: () => 10,
      paddingRight: () => 10,
      paddingTop: () => 7,
      paddingBottom: () => 7,
    },
  };
}

/** The diagonal watermark of a status, when it has one. */
export function watermarkFor(look: StatusLook | null): Watermark | undefined {
  if (!look) return undefined;
  return { text: look.word, color: look.color, opacity: 0.09, bold: true, font: FONT_HEADING, fontSize: look.word.length > 7 ? 86 : 110 };
}
