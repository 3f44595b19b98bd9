/** Query keys of observations: everything under ['observations', propertyId] is refreshed after a write. */
export const observationKeys = {
  all: ['observations'] as const,
  property: (propertyId: number) => ['observations', propertyId] as const,
  list: (propertyId: number, query: string) => ['observations', propertyId, 'list', query] as const,
  summary: (propertyId: number, by: 'unit' | 'month') => ['observations', propertyId, 'summary', by] as const,
};
