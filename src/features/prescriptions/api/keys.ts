/** Query keys the prescriptions use, shared in shape with the library, the plan map and the properties pages so caches line up. */
import { propertyKeys } from '../../../lib/resources/property';
export const prescriptionKeys = {
  all: () => ['prescriptions'] as const,
  unit: (unitId: number) => ['prescriptions', { unitId }] as const,
  forProperty: (propertyId: number) => ['prescriptions', { propertyId }] as const,
  practices: () => ['practices'] as const,
  /** Archived materials too: older prescriptions still use them. */
  materials: () => ['materials', { includeArchived: true }] as const,
  rates: () => ['rates'] as const,
  firm: () => ['firm'] as const,
  property: propertyKeys.detail,
  units: (propertyId: number) => ['units', { propertyId }] as const,
};
