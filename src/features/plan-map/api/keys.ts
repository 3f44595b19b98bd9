/** Query keys of the plan map, hierarchical so that a prefix invalidates a whole family. */
export const planMapKeys = {
  property: (propertyId: number) => ['properties', 'detail', propertyId] as const,
  units: (propertyId: number) => ['units', { propertyId }] as const,
  plan: (propertyId: number) => ['plan', { propertyId }] as const,
  overlays: (propertyId: number) => ['overlays', { propertyId }] as const,
  firm: () => ['firm'] as const,
};
