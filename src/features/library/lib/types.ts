import type { ServiceRate } from '../../../../shared/domain/service-rates';

/** A service rate over the API. */
export type RateDto = ServiceRate & { id: number; archived: boolean; updatedAt: string };
