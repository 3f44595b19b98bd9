/** Short phrases for a task, shared by the week list, the timeline and the panel. */
import { formatMonthDay } from '../../../../shared/domain/planting-windows';
import type { TaskDto } from '../../../../shared/schemas/task';

/** "Jun 1 – Jun 30, 2026" for a task's window, or "Jul 20, 2026 – Mar 22, 2027" across a new year. */
export const windowText = (t: Pick<TaskDto, 'earliest' | 'latest'>): string => {
  const [y1, y2] = [t.earliest.slice(0, 4), t.latest.slice(0, 4)];
  return y1 === y2 ? `${formatMonthDay(t.earliest)} – ${formatMonthDay(t.latest)}, ${y2}` : `${formatMonthDay(t.earliest)}, ${y1} – ${formatMonthDay(t.latest)}, ${y2}`;
};

/** "Jun 12", "Jun 12 – Jun 14", or "not scheduled". */
export const datesText = (t: Pick<TaskDto, 'startDate' | 'endDate'>): string =>
  !t.startDate ? 'not scheduled' : t.endDate && t.endDate !== t.startDate ? `${formatMonthDay(t.startDate)} – ${formatMonthDay(t.endDate)}` : formatMonthDay(t.startDate);

/** "Monday, Jun 8". */
export const dayHeading = (date: string): string => `${new Date(`${date}T00:00:00Z`).toLocaleDateString('en-US', { weekday: 'long', timeZone: 'UTC' })}, ${formatMonthDay(date)}`;
