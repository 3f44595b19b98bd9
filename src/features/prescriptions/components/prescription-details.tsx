import type { ReactNode } from 'react';
import { CautionBox } from '../../../components/ui/card';
import { formatDollars } from '../../../../shared/domain/prescription-summary';
import { formatMonthDay, type ScheduleWarning } from '../../../../shared/domain/planting-windows';
import type { MaterialPurchase } from '../../../../shared/domain/prescription-quantities';
import { formatDateRange, formatQuantity, plural } from '../../../lib/quantity-format';
import type { PrescriptionView } from '../lib/types';

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section aria-label={title} className="flex flex-col gap-2">
      <h3 className="text-sm font-bold uppercase tracking-wide text-slate" style={{ fontFamily: 'inherit' }}>
        {title}
      </h3>
      {children}
    </section>
  );
}

function Figure({ label, value, note }: { label: string; value: string; note?: string }) {
  return (
    <div className="rounded border border-rule bg-paper/60 px-3 py-2">
      <dt className="text-xs uppercase tracking-wide text-slate">{label}</dt>
      <dd className="figure text-base font-bold text-ink">{value}</dd>
      {note ? <dd className="text-xs text-slate">{note}</dd> : null}
    </div>
  );
}

const NEEDED_UNIT_WORDS: Record<MaterialPurchase['neededUnit'], [string, string]> = { lb: ['lb', 'lb'], ton: ['ton', 'tons'], gal: ['gal', 'gal'], item: ['item', 'items'] };

/** "18.74 lb → 2 × 10-lb bag, 1.26 lb left over", or "13.88 tons" for a purchase bought by measure. */
export function purchaseText(p: MaterialPurchase, packageLabel?: string): string {
  const [one, many] = NEEDED_UNIT_WORDS[p.neededUnit];
  const digits = p.neededUnit === 'item' ? 0 : 2;
  const needed = `${formatQuantity(p.needed, digits)} ${p.needed === 1 ? one : many}`;
  if (p.packages === null) return needed;
  const what = packageLabel ?? (p.packageSize === null ? 'package' : `${formatQuantity(p.packageSize)}-${one} package`);
  const leftover = p.leftover && p.leftover > 1e-9 ? `, ${formatQuantity(p.leftover, digits)} ${p.leftover === 1 ? one : many} left over` : '';
  return `${needed} → ${p.packages} × ${what}${leftover}`;
}

function WarningLine({ warning }: { warning: ScheduleWarning }) {
  const isWarning = warning.severity === 'warning';
  return (
    <p className={`mt-1 rounded px-2 py-1 text-xs ${isWarning ? 'border-l-4 border-clay bg-clay/10 text-ink' : 'border-l-4 border-ochre bg-ochre/15 text-ink'}`}>
      <span className={`font-semibold ${isWarning ? 'text-[#A04A25]' : 'text-ink'}`}>{isWarning ? 'Warning: ' : 'Note: '}</span>
      {warning.message}
    </p>
  );
}

const CATEGORY_LABELS = [
  ['materialCents', 'Materials'],
  ['laborCents', 'Labor'],
  ['equipmentCents', 'Equipment'],
  ['feesCents', 'Fees'],
] as const;

/**
 * A prescription's content for the landowner and the crew: the summary, what to buy, the step
 * schedule with its warnings, the cost by category and the cautions. Used for saved prescriptions
 * and for the live preview alike.
 */
export function PrescriptionDetails({ view, summary = true }: { view: PrescriptionView; summary?: boolean }) {
  // The seeding (anchor) step sorts by its target date, the others by the first day of their window.
  const sortKey = (s: (typeof view.schedule.steps)[number]) => (s.isAnchor ? view.schedule.targetDate : s.earliest);
  const schedule = [...view.schedule.steps].sort((a, b) => (sortKey(a) < sortKey(b) ? -1 : sortKey(a) > sortKey(b) ? 1 : 0));
  const targetShown = view.schedule.targetDate !== view.schedule.anchorWindow.earliest;
  const skipped = new Set(view.steps.filter((s) => s.skipped).map((s) => s.stepKey));
  const looseWarnings = view.warnings.filter((w) => !w.stepKey || !schedule.some((s) => s.stepKey === w.stepKey));
  const figures: { label: string; value: string; note?: string }[] = [];
  if (view.bulkSeedLb > 0) figures.push({ label: 'Seed', value: `${formatQuantity(view.bulkSeedLb, 1)} lb`, note: `${formatQuantity(view.plsSeedLb, 1)} lb PLS · ${plural(view.packages, 'package')}` });
  if (view.limeTons > 0) figures.push({ label: 'Lime', value: `${formatQuantity(view.limeTons, 2)} tons` });
  if (view.fertilizerProductLb > 0) figures.push({ label: 'Fertilizer', value: `${formatQuantity(view.fertilizerProductLb, 0)} lb`, note: plural(view.fertilizerBags, 'bag') });
  if (view.herbicideProductGal > 0) figures.push({ label: 'Herbicide', value: `${formatQuantity(view.herbicideProductGal, 2)} gal`, note: plural(view.tankLoads, 'tank load') });
  if (view.laborHours > 0 || view.equipmentHours > 0) {
    const note = [view.laborHours > 0 ? `${formatQuantity(view.laborHours, 1)} labor` : null, view.equipmentHours > 0 ? `${formatQuantity(view.equipmentHours, 1)} equipment` : null].filter(Boolean).join(' · ');
    figures.push({ label: 'Hours', value: `${formatQuantity(view.laborHours + view.equipmentHours, 1)} h`, note });
  }
  return (
    <div className="flex flex-col gap-4 text-sm">
      {summary ? <p className="font-serif leading-relaxed text-ink">{view.summary}</p> : null}

      {figures.length > 0 ? (
        <Section title="Quantities">
          <dl className="grid grid-cols-2 gap-2">
            {figures.map((f) => (
              <Figure key={f.label} {...f} />
            ))}
          </dl>
        </Section>
      ) : null}

      {view.purchases.length > 0 ? (
        <Section title="To buy">
          <ul className="flex flex-col divide-y divide-rule/70">
            {view.purchases.map((p) => (
              <li key={p.materialKey} className="flex items-baseline justify-between gap-3 py-1.5">
                <span className="min-w-0">
                  <span className="font-semibold">{p.name}</span>
                  <span className="block text-xs text-slate">{purchaseText(p, view.lines.find((l) => l.materialKey === p.materialKey)?.unit)}</span>
                </span>
                <span className="shrink-0 tabular-nums">{formatDollars(p.amountCents)}</span>
              </li>
            ))}
          </ul>
        </Section>
      ) : null}

      <Section title="Schedule">
        {looseWarnings.map((w, i) => (
          <WarningLine key={i} warning={w} />
        ))}
        <ol className="flex flex-col divide-y divide-rule/70">
          {schedule.map((s) => (
            <li key={s.stepKey} className={`py-1.5 ${skipped.has(s.stepKey) ? 'opacity-60' : ''}`}>
              <div className="flex items-baseline justify-between gap-3">
                <span className={s.isAnchor ? 'font-semibold' : ''}>
                  {s.name}
                  {s.isAnchor ? <span className="ml-2 rounded bg-moss/10 px-1.5 py-0.5 text-xs font-semibold text-moss-deep">window</span> : null}
                  {skipped.has(s.stepKey) ? <span className="ml-2 text-xs text-slate">(skipped)</span> : null}
                </span>
                <span className="shrink-0 text-right text-xs tabular-nums text-slate">
                  {formatDateRange(s.earliest, s.latest)}
                  {s.isAnchor && targetShown ? <span className="block font-semibold text-ink">target {formatDateRange(view.schedule.targetDate, view.schedule.targetDate)}</span> : null}
                </span>
              </div>
              {view.warnings
                .filter((w) => w.stepKey === s.stepKey)
                .map((w, i) => (
                  <WarningLine key={i} warning={w} />
                ))}
            </li>
          ))}
        </ol>
        {view.schedule.grazeable ? (
          <p className="text-xs text-slate">
            Grazeable about {formatDateRange(view.schedule.grazeable.earliest, view.schedule.grazeable.latest)}
            {view.schedule.firstFrostDate && view.schedule.daysBeforeFirstFrost !== null
              ? `; average first frost ${formatMonthDay(view.schedule.firstFrostDate)}, ${view.schedule.daysBeforeFirstFrost} days after the target seeding date`
              : ''}
            .
          </p>
        ) : null}
      </Section>

      <Section title="Cost">
        <table className="w-full">
          <tbody>
            {CATEGORY_LABELS.filter(([key]) => view[key] > 0).map(([key, label]) => (
              <tr key={key} className="border-b border-rule/70">
                <th scope="row" className="py-1 text-left font-normal">
                  {label}
                  {key === 'laborCents' && view.laborHours > 0 ? <span className="text-xs text-slate"> · {formatQuantity(view.laborHours, 1)} h</span> : null}
                  {key === 'equipmentCents' && view.equipmentHours > 0 ? <span className="text-xs text-slate"> · {formatQuantity(view.equipmentHours, 1)} h</span> : null}
                </th>
                <td className="figure py-1 text-right">{formatDollars(view[key])}</td>
              </tr>
            ))}
            <tr>
              <th scope="row" className="pt-2 text-left font-serif font-bold">
                Total
              </th>
              <td className="figure pt-2 text-right text-lg font-bold" data-testid="prescription-total">
                {formatDollars(view.totalCents)}
              </td>
            </tr>
          </tbody>
        </table>
        <details className="text-xs">
          <summary className="cursor-pointer text-moss-deep">Priced lines ({view.lines.length})</summary>
          <table className="mt-2 w-full">
            <tbody>
              {view.lines.map((l, i) => (
                <tr key={i} className="border-b border-rule/60 align-top">
                  <td className="py-1 pr-2">
                    {l.description}
                    {l.pricingNote ? <span className="block text-slate">Staff note: {l.pricingNote}</span> : null}
                  </td>
                  <td className="whitespace-nowrap py-1 pr-2 text-right tabular-nums text-slate">
                    {formatQuantity(l.quantity)} {l.unit}
                  </td>
                  <td className="whitespace-nowrap py-1 text-right tabular-nums">{formatDollars(l.amountCents)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </details>
      </Section>

      {view.cautions.length > 0 ? (
        <Section title="Cautions">
          {view.cautions.map((c) => (
            <CautionBox key={c.id} title={c.title}>
              <p>{c.text}</p>
            </CautionBox>
          ))}
        </Section>
      ) : null}
    </div>
  );
}
