/** Query keys of the practice library, hierarchical so that a prefix invalidates a whole family. */
export const libraryKeys = {
  practices: () => ['practices'] as const,
  practice: (id: number) => ['practices', 'detail', id] as const,
  materials: (filter: { kind?: string; includeArchived?: boolean } = {}) => ['materials', filter] as const,
  rates: () => ['rates'] as const,
};
