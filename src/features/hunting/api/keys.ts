/** Query keys of the hunting planner, per property. */
export const huntingKeys = {
  all: ['hunting'] as const,
  standWinds: (propertyId: number) => ['hunting', 'stand-winds', propertyId] as const,
  pressure: (propertyId: number) => ['hunting', 'pressure', propertyId] as const,
  windRecord: (propertyId: number) => ['hunting', 'wind-record', propertyId] as const,
  sits: (propertyId: number) => ['hunting', 'sits', propertyId] as const,
  warnings: ['hunting', 'pressure-warnings'] as const,
};
