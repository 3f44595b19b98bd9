/** Pressure per stand from sits; every value worked by hand from the sits below. */
import { describe, expect, it } from 'vitest';
import { daysBetween, standPressure, type PressureSit } from '../../../shared/domain/pressure';
import { WIND_NAMES } from '../../../shared/domain/stand-winds';

const winds = WIND_NAMES.map((from) => ({ from, suitable: from !== 'S' }));
const sit = (start: string, hours: number, windFrom: PressureSit['windFrom'], deer: [number, number, number], standUnitId = 1): PressureSit => ({
  standUnitId,
  startedAt: new Date(start),
  endedAt: new Date(Date.parse(start) + hours * 3600_000),
  windFrom,
  bucks: deer[0],
  does: deer[1],
  fawns: deer[2],
});

describe('stand pressure', () => {
  it('counts sits, hours, deer per hour, days rested and sits on an unsuitable wind', () => {
    const sits = [
      sit('2026-11-10T12:00:00Z', 3, 'N', [1, 2, 0]),
      sit('2026-11-12T12:00:00Z', 2.5, 'S', [0, 3, 1]),
      sit('2026-11-13T22:00:00Z', 1.5, null, [0, 0, 0]),
      sit('2026-11-12T12:00:00Z', 2, 'S', [0, 0, 0], 2),
    ];
    const [one, two, three] = standPressure(
      [
        { unitId: 1, name: 'Oak', winds },
        { unitId: 2, name: 'Ridge', winds },
        { unitId: 3, name: 'Creek', winds },
      ],
      sits,
      '2026-11-15',
      'America/Chicago',
      2,
    );
    // Hours 3 + 2.5 + 1.5 = 7; deer 3 + 4 + 0 = 7 → 1 per hour; the last sit began 16:00 on 13 Nov in Chicago → 2 days rested.
    expect(one).toMatchObject({ sits: 3, hours: 7, deerPerHour: 1, lastSitOn: '2026-11-13', daysSinceLastSit: 2, sitsOnUnsuitableWind: 1, sitsThisWeek: 3, overPressured: true });
    expect(two).toMatchObject({ sits: 1, hours: 2, deerPerHour: 0, sitsOnUnsuitableWind: 1, overPressured: false });
    expect(three).toMatchObject({ sits: 0, hours: 0, deerPerHour: null, lastSitOn: null, daysSinceLastSit: null, sitsThisWeek: 0 });
  });

  it('counts days across a month end', () => {
    expect(daysBetween('2026-10-30', '2026-11-02')).toBe(3);
  });
});
