import { Bar, BarChart, CartesianGrid, Cell, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';
import { formatCents } from '../../../../shared/domain/money';
import { useReceivables } from '../api/get-receivables';
import { Card, ErrorPanel, Loading } from '../../../components/ui/card';

// DESIGN.md: moss for current money, ochre, clay as it ages.
const BAR_COLOURS: Record<string, string> = { current: '#3F6B3A', days1to30: '#C99A2E', days31to60: '#B5562B', days61to90: '#B5562B', over90: '#8E3F2A' };

/** Receivables: outstanding by age as a bar chart and a table (the same figures), paid this month. */
export function ReceivablesPanel() {
  const r = useReceivables();
  if (r.isPending) return <Loading label="Loading receivables…" />;
  if (r.isError) return <ErrorPanel error={r.error} onRetry={() => void r.refetch()} />;
  const d = r.data;
  const chart = d.buckets.map((b) => ({ label: b.label, dollars: b.amountCents / 100, key: b.key }));
  return (
    <Card title="Receivables">
      <div className="grid gap-4 md:grid-cols-[1fr_16rem]">
        <figure aria-label="Outstanding by age" className="h-48 min-w-0">
          <ResponsiveContainer width="100%" height="100%">
            <BarChart data={chart} margin={{ top: 4, right: 4, bottom: 0, left: 0 }}>
              <CartesianGrid vertical={false} stroke="#D9D3C3" />
              <XAxis dataKey="label" tick={{ fontSize: 11, fill: '#5B6770' }} interval={0} />
              <YAxis tick={{ fontSize: 11, fill: '#5B6770' }} width={56} tickFormatter={(v: number) => `$${v.toLocaleString('en-US')}`} />
              <Tooltip formatter={(v) => [formatCents(Math.round(Number(v) * 100)), 'Outstanding']} />
              <Bar dataKey="dollars" isAnimationActive={false} fill="#3F6B3A">
                {chart.map((c) => (
                  <Cell key={c.key} fill={BAR_COLOURS[c.key]} />
                ))}
              </Bar>
            </BarChart>
          </ResponsiveContainer>
        </figure>
        <dl className="grid grid-cols-[1fr_auto] content-start gap-x-3 gap-y-1 text-sm tabular-nums" aria-label="Receivables figures">
          {d.buckets.map((b) => (
            <div key={b.key} className="contents">
              <dt className="text-slate">{b.label}</dt>
              <dd className="text-right">{formatCents(b.amountCents)}</dd>
            </div>
          ))}
          <dt className="border-t border-rule pt-1 font-semibold">Outstanding</dt>
          <dd className="border-t border-rule pt-1 text-right font-heading font-bold" data-testid="outstanding">{formatCents(d.outstandingCents)}</dd>
          <dt className="text-clay">of which overdue</dt>
          <dd className="text-right text-clay">{formatCents(d.overdueCents)}</dd>
          <dt className="pt-2 text-slate">Paid this month</dt>
          <dd className="pt-2 text-right font-semibold text-moss-deep">{formatCents(d.paidThisMonthCents)}</dd>
        </dl>
      </div>
    </Card>
  );
}
