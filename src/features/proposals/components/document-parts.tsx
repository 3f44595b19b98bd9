/** The parts of a proposal as a document, shared by the consultant's read-only view and the portal. */
import type { ProposalTotalsFigures } from '../../../../shared/schemas/proposal-dto';
import type { ReactNode } from 'react';
import { formatCents } from '../../../../shared/domain/money';
import type { OrderDiscount } from '../../../../shared/domain/proposal-totals';
import { KIND_STYLES, type UnitKind } from '../../../../shared/domain/unit-kinds';
import { CautionBox } from '../../../components/ui/card';
import { formatAcres, formatFeet } from '../../../lib/format';
import type { ProposalApprovalDto, ProposalDto, ProposalGroupDto, ProposalLineDto } from '../../../../shared/schemas/proposal-dto';
import { trimDecimal, percentText } from '../utils/draft-form';
import { formatMoment } from '../utils/dates';

/** A unit's size: acres for areas, feet for lines, nothing for points. */
export function groupSize(group: Pick<ProposalGroupDto, 'acres' | 'lengthFt'> | undefined): string | null {
  if (!group) return null;
  if (group.acres !== null) return formatAcres(group.acres);
  if (group.lengthFt !== null) return formatFeet(group.lengthFt);
  return null;
}

/** A small swatch in the unit kind's own colours (DESIGN.md), with its name for screen readers. */
export function KindSwatch({ kind }: { kind: string | null }) {
  const style = kind && kind in KIND_STYLES ? KIND_STYLES[kind as UnitKind] : null;
  if (!style) return <span aria-hidden className="inline-block size-3 shrink-0 rounded-sm border border-rule bg-paper" />;
  return (
    <span
      role="img"
      aria-label={style.label}
      title={style.label}
      className={`inline-block size-3 shrink-0 border-2 ${style.family === 'point' ? 'rounded-full' : 'rounded-sm'}`}
      style={{ backgroundColor: style.fill, borderColor: style.stroke, borderStyle: style.dash === 'solid' ? 'solid' : style.dash }}
    />
  );
}

/** What will be done, unit by unit, in plain words. */
export function WorkByUnit({ groups }: { groups: ProposalGroupDto[] }) {
  return (
    <ol className="flex flex-col divide-y divide-rule">
      {groups.map((g) => {
        const size = groupSize(g);
        return (
          <li key={g.label} className="py-3 first:pt-0 last:pb-0">
            <h3 className="flex flex-wrap items-center gap-x-2 text-base font-bold">
              <KindSwatch kind={g.kind} />
              <span>{g.label}</span>
              {size ? <span className="figure text-sm font-normal text-slate">{size}</span> : null}
            </h3>
            {g.summaries.length ? (
              <ul className="mt-1 flex flex-col gap-1 text-sm">
                {g.summaries.map((s) => (
                  <li key={s}>{s}</li>
                ))}
              </ul>
            ) : (
              <p className="mt-1 text-sm text-slate">Priced line by line below.</p>
            )}
          </li>
        );
      })}
    </ol>
  );
}

/** The lines grouped by their unit, in order of first appearance. */
export function linesByGroup(lines: readonly ProposalLineDto[]): { label: string; lines: ProposalLineDto[] }[] {
  const groups = new Map<string, ProposalLineDto[]>();
  for (const line of lines) groups.set(line.groupLabel, [...(groups.get(line.groupLabel) ?? []), line]);
  return [...groups.entries()].map(([label, ls]) => ({ label, lines: ls }));
}

function LineTable({ lines, includedOf, currency }: { lines: ProposalLineDto[]; includedOf: (l: ProposalLineDto) => boolean; currency: string }) {
  return (
    <table className="w-full border-collapse text-sm">
      <thead>
        <tr className="border-b border-rule text-left text-xs uppercase tracking-wide text-slate">
          <th scope="col" className="py-1 pr-2 font-semibold">Item</th>
          <th scope="col" className="hidden whitespace-nowrap py-1 pr-1 text-right font-semibold sm:table-cell">Qty</th>
          <th scope="col" className="hidden whitespace-nowrap py-1 pr-2 font-semibold sm:table-cell">Unit</th>
          <th scope="col" className="hidden whitespace-nowrap py-1 pr-2 text-right font-semibold sm:table-cell">Unit price</th>
          <th scope="col" className="whitespace-nowrap py-1 text-right font-semibold">Amount</th>
        </tr>
      </thead>
      <tbody>
        {lines.map((l) => {
          const included = includedOf(l);
          return (
            <tr key={l.id} className={`border-b border-rule/60 align-top last:border-0 ${included ? '' : 'text-slate'}`}>
              <td className="py-1.5 pr-2">
                {l.description}
                {l.optional ? <span className="ml-1 rounded border border-sky px-1 text-xs font-semibold text-sky">{included ? 'Option, chosen' : 'Option'}</span> : null}
                <span className="block text-xs text-slate sm:hidden">
                  {trimDecimal(l.quantity)} {l.unit} × {formatCents(l.unitPriceCents, currency)}
                </span>
              </td>
              <td className="hidden whitespace-nowrap py-1.5 pr-1 text-right sm:table-cell">{trimDecimal(l.quantity)}</td>
              <td className="hidden py-1.5 pr-2 text-slate sm:table-cell">{l.unit}</td>
              <td className="hidden whitespace-nowrap py-1.5 pr-2 text-right sm:table-cell">{formatCents(l.unitPriceCents, currency)}</td>
              <td className="whitespace-nowrap py-1.5 text-right">{included ? formatCents(l.amountCents, currency) : <span title="Not in the total">({formatCents(l.amountCents, currency)})</span>}</td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}

/**
 * The priced lines by unit. `collapsible` folds each unit (phones); `includedOf` says whether a line
 * counts (the landowner's ticked options), defaulting to the server's answer.
 */
export function LineItemsByUnit({
  proposal,
  collapsible = false,
  includedOf = (l) => l.included,
}: {
  proposal: Pick<ProposalDto, 'lines' | 'groups' | 'currency'>;
  collapsible?: boolean;
  includedOf?: (l: ProposalLineDto) => boolean;
}) {
  const groups = linesByGroup(proposal.lines);
  return (
    <div className="flex flex-col gap-3">
      {groups.map((g) => {
        const meta = proposal.groups.find((x) => x.label === g.label);
        const size = groupSize(meta);
        const sum = g.lines.reduce((s, l) => (includedOf(l) ? s + l.amountCents : s), 0);
        const heading = (
          <span className="flex flex-1 flex-wrap items-baseline justify-between gap-x-3">
            <span className="flex items-center gap-2 font-serif font-bold text-ink">
              <KindSwatch kind={meta?.kind ?? null} />
              {g.label}
              {size ? <span className="font-sans text-sm font-normal text-slate">{size}</span> : null}
            </span>
            <span className="figure text-sm text-ink">
              {g.lines.length} {g.lines.length === 1 ? 'item' : 'items'} · {formatCents(sum, proposal.currency)}
            </span>
          </span>
        );
        const table = <LineTable lines={g.lines} includedOf={includedOf} currency={proposal.currency} />;
        return collapsible ? (
          <details key={g.label} className="group rounded border border-rule bg-card px-3 py-2">
            <summary className="flex cursor-pointer list-none items-center gap-2 [&::-webkit-details-marker]:hidden">
              <span aria-hidden className="text-slate transition-transform group-open:rotate-90">▸</span>
              {heading}
            </summary>
            <div className="mt-2">{table}</div>
          </details>
        ) : (
          <section key={g.label} aria-label={g.label} className="rounded border border-rule bg-card px-3 py-2">
            <h3 className="mb-1 flex text-base">{heading}</h3>
            {table}
          </section>
        );
      })}
    </div>
  );
}

/** The totals a proposal shows (all in cents): the one shape in shared/schemas/proposal-dto.ts. */
export type TotalsFigures = ProposalTotalsFigures;

function Row({ label, value, strong = false, note, figure }: { label: ReactNode; value: string; strong?: boolean; note?: ReactNode; figure: string }) {
  return (
    <div className={`flex items-baseline justify-between gap-3 py-1 ${strong ? 'border-t border-rule pt-2' : ''}`}>
      <dt className={strong ? 'font-semibold text-ink' : 'text-slate'}>
        {label}
        {note ? <span className="block text-xs text-slate" data-figure={`${figure}-note`}>{note}</span> : null}
      </dt>
      <dd data-figure={figure} className={`figure whitespace-nowrap text-right ${strong ? 'text-2xl font-bold text-ink' : 'text-ink'}`}>{value}</dd>
    </div>
  );
}

/** Subtotal, discount, tax, total, deposit and balance. */
export function TotalsList({ totals, taxRatePct, depositPct, discount, currency = 'USD', label = 'Totals' }: { totals: TotalsFigures; taxRatePct: string | number; depositPct: string | number; discount: OrderDiscount; currency?: string; label?: string }) {
  const pct = (v: string | number) => (typeof v === 'number' ? percentText(v) : v.trim());
  return (
    <dl aria-label={label} className="flex flex-col text-sm">
      <Row figure="subtotal" label="Subtotal" value={formatCents(totals.subtotalCents, currency)} />
      {totals.discountCents > 0 || discount.kind !== 'none' ? (
        <Row figure="discount" label={discount.kind === 'percent' ? `Discount (${pct(discount.percent)} %)` : 'Discount'} value={`−${formatCents(totals.discountCents, currency)}`} />
      ) : null}
      <Row figure="tax" label={`Sales tax (${pct(taxRatePct)} %)`} note={`on ${formatCents(totals.taxableCents, currency)} of taxable goods`} value={formatCents(totals.taxCents, currency)} />
      <Row figure="total" label="Total" value={formatCents(totals.totalCents, currency)} strong />
      <Row figure="deposit" label={`Deposit due on approval (${pct(depositPct)} %)`} value={formatCents(totals.depositCents, currency)} />
      <Row figure="balance" label="Balance, invoiced as the work is done" value={formatCents(totals.balanceCents, currency)} />
    </dl>
  );
}

/** The terms as written, line breaks kept. */
export function TermsText({ terms }: { terms: string }) {
  return terms.trim() ? <div className="whitespace-pre-line text-sm leading-relaxed">{terms}</div> : <p className="text-sm text-slate">No terms written.</p>;
}

/** The cautions of the planned work, each boxed in clay. */
export function CautionList({ cautions }: { cautions: ProposalDto['cautions'] }) {
  return (
    <div className="flex flex-col gap-2">
      {cautions.map((c) => (
        <CautionBox key={c.id} title={c.title}>
          <p>{c.text}</p>
        </CautionBox>
      ))}
    </div>
  );
}

/** The approval record: the typed name, when, the options chosen and the SHA-256 of the approved content. */
export function ApprovalRecord({ approval, lines, showTechnical = false }: { approval: ProposalApprovalDto; lines: ProposalLineDto[]; showTechnical?: boolean }) {
  const chosen = lines.filter((l) => l.optional && approval.selectedOptionIds.includes(l.id));
  return (
    <section aria-label="Approval record" className="rounded-md border-l-4 border-moss bg-moss/5 px-4 py-3 text-sm">
      <p className="font-serif text-base font-bold text-moss-deep">
        Approved by {approval.signedName} on {formatMoment(approval.signedAt)}
      </p>
      <p className="mt-1">{chosen.length ? `Options chosen: ${chosen.map((l) => l.description).join('; ')}.` : 'No options chosen.'}</p>
      <p className="mt-1 text-slate">
        Approval fingerprint <span className="text-xs">(a code computed from everything approved; any change would change it)</span>:{' '}
        <code className="break-all font-mono text-xs text-ink">{approval.contentHash}</code>
      </p>
      {showTechnical && (approval.ip || approval.userAgent) ? (
        <p className="mt-1 break-words text-xs text-slate">
          Signed from {approval.ip ?? 'an unknown address'}
          {approval.userAgent ? ` · ${approval.userAgent}` : ''}
        </p>
      ) : null}
    </section>
  );
}
