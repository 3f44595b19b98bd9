/** Query keys of the plan map, hierarchical so that a prefix invalidates a whole family. */
import { propertyKeys } from '../../../lib/resources/property';
export const planMapKeys = {
  property: propertyKeys.detail,
  units: (propertyId: number) => ['units', { propertyId }] as const,
  plan: (propertyId: number) => ['plan', { propertyId }] as const,
  overlays: (propertyId: number) => ['overlays', { propertyId }] as const,
  firm: () => ['firm'] as const,
};
