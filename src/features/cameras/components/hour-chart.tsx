/** Events by hour of the firm's day as 24 bars (recharts; a lazy chunk). */
import { Bar, BarChart, CartesianGrid, ResponsiveContainer, Tooltip, XAxis, YAxis } from 'recharts';

const hourLabel = (h: number) => `${String(h).padStart(2, '0')}:00`;

export default function HourChart({ counts, label, colour }: { counts: number[]; label: string; colour: string }) {
  const data = counts.map((n, h) => ({ hour: h, label: hourLabel(h), events: n }));
  return (
    <div className="h-52 w-full" role="img" aria-label={label}>
      <ResponsiveContainer width="100%" height="100%">
        <BarChart data={data} margin={{ top: 8, right: 8, bottom: 0, left: -20 }} barCategoryGap={2}>
          <CartesianGrid strokeDasharray="3 3" vertical={false} />
          <XAxis dataKey="hour" tick={{ fontSize: 11 }} interval={2} tickFormatter={(h: number) => String(h)} />
          <YAxis allowDecimals={false} tick={{ fontSize: 11 }} />
          <Tooltip labelFormatter={(h) => `${hourLabel(Number(h))}–${hourLabel((Number(h) + 1) % 24)}`} formatter={(v) => [v, 'events']} />
          <Bar dataKey="events" fill={colour} isAnimationActive={false} />
        </BarChart>
      </ResponsiveContainer>
    </div>
  );
}
