/** The property shown on the plan map: the shared query options of GET /api/properties/:id (src/lib/resources/property.ts). */
export { getProperty, getPropertyQueryOptions, useProperty } from '../../../lib/resources/property';
