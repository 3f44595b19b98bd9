/** Query keys of the field sheet (tasks share the ['tasks'] prefix with the schedule, so a write refreshes both). */
export const fieldKeys = {
  tasks: ['tasks'] as const,
  mine: ['tasks', 'mine'] as const,
  task: (id: number) => ['tasks', 'detail', id] as const,
  feeds: ['calendar-feeds'] as const,
};
