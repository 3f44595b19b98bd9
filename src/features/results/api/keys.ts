/** Query keys of a property's results, hierarchical so that a prefix invalidates a whole family. */
export const resultsKeys = {
  all: () => ['results'] as const,
  property: (propertyId: number) => ['results', { propertyId }] as const,
};
