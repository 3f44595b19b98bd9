/** Query keys of checks on units, hierarchical so that a prefix invalidates a whole family. */
export const checksKeys = {
  all: () => ['checks'] as const,
  unit: (unitId: number) => ['checks', { unitId }] as const,
  plotStatuses: (propertyId: number) => ['checks', 'plot-statuses', { propertyId }] as const,
  unitDetail: (unitId: number) => ['checks', 'unit-detail', unitId] as const,
  history: (unitId: number) => ['checks', 'history', unitId] as const,
};
