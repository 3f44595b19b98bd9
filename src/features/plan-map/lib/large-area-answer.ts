/** Recognises the server's refusal of an unconfirmed large area (422 naming `confirmLargeArea`). */
import { ApiError } from '../../../lib/api-client';
import { CONFIRM_LARGE_AREA_FIELD } from '../../../../shared/domain/large-area';

/** True when the error is a 422 whose details name `confirmLargeArea` (alone or as `units.N.confirmLargeArea`). */
export function isLargeAreaRefusal(err: unknown): err is ApiError {
  if (!(err instanceof ApiError) || err.status !== 422 || !Array.isArray(err.details)) return false;
  return err.details.some((d) => typeof (d as { path?: unknown })?.path === 'string' && ((d as { path: string }).path === CONFIRM_LARGE_AREA_FIELD || (d as { path: string }).path.endsWith(`.${CONFIRM_LARGE_AREA_FIELD}`)));
}
