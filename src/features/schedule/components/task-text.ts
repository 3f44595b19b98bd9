/** Short phrases for a task, shared by the week list, the timeline and the panel. */
import { formatMonthDay } from '../../../../shared/domain/planting-windows';
import type { TaskDto } from '../../../../shared/schemas/task';

/** "Jun 1 – Jun 30" for a task's window. */
export const windowText = (t: Pick<TaskDto, 'earliest' | 'latest'>): string => `${formatMonthDay(t.earliest)} – ${formatMonthDay(t.latest)}`;

/** "Jun 12", "Jun 12 – Jun 14", or "not scheduled". */
export const datesText = (t: Pick<TaskDto, 'startDate' | 'endDate'>): string =>
  !t.startDate ? 'not scheduled' : t.endDate && t.endDate !== t.startDate ? `${formatMonthDay(t.startDate)} – ${formatMonthDay(t.endDate)}` : formatMonthDay(t.startDate);

/** "Monday, Jun 8". */
export const dayHeading = (date: string): string => `${new Date(`${date}T00:00:00Z`).toLocaleDateString('en-US', { weekday: 'long', timeZone: 'UTC' })}, ${formatMonthDay(date)}`;
