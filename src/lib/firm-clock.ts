/** The client's side of the firm's clock (shared/domain/clock.ts): the zone comes with the signed-in user. */
import { useMe } from '../features/auth/api/get-me';
import { DEFAULT_TIME_ZONE, formatDayOf, formatMoment, todayIn, type IsoDate } from '../../shared/domain/clock';

/** The firm's IANA time zone (the default until the signed-in user is known). */
export function useFirmZone(): string {
  const me = useMe();
  return me.data?.firmTimezone ?? DEFAULT_TIME_ZONE;
}

/** Today's date in the firm's time zone, whatever zone the browser is in. */
export function useFirmToday(): IsoDate {
  return todayIn(useFirmZone(), new Date());
}

/** Formatters bound to the firm's zone: the day of an instant and the instant with its zone. */
export function useFirmTime() {
  const zone = useFirmZone();
  return {
    zone,
    today: todayIn(zone, new Date()),
    day: (instant: string | Date) => formatDayOf(instant, zone),
    moment: (instant: string | Date) => formatMoment(instant, zone),
  };
}
