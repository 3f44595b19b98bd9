import type { SitDto, WindRecordDto } from '../../shared/schemas/hunting';
import type { Sit, WindRecord } from '../models';
import type { StandWinds, WindName } from '../../shared/domain/stand-winds';
import { suitsWind } from '../../shared/domain/pressure';

/** A wind record as the API answers it. */
export function presentWindRecord(r: WindRecord): WindRecordDto {
  return {
    rose: r.rose as WindRecordDto['rose'],
    hours: r.hours,
    calmHours: r.calmHours,
    skippedRows: r.skippedRows,
    source: r.source as WindRecordDto['source'],
    fileName: r.fileName,
    months: r.months,
    hoursFilter: r.hoursFilter as WindRecordDto['hoursFilter'],
    updatedAt: r.updatedAt.toISOString(),
  };
}

/** A sit with its stand's name and whether the stand suits the sit's wind. */
export function presentSit(s: Sit, stands: readonly StandWinds[]): SitDto {
  const stand = stands.find((x) => x.unitId === s.standUnitId);
  return {
    id: s.id,
    propertyId: s.propertyId,
    standUnitId: s.standUnitId,
    standName: stand?.name ?? 'Stand',
    startedAt: s.startedAt.toISOString(),
    endedAt: s.endedAt.toISOString(),
    windFrom: (s.windFrom as WindName | null) ?? null,
    windMph: s.windMph,
    seen: { bucks: s.bucks, does: s.does, fawns: s.fawns },
    notes: s.notes,
    buckIds: s.buckIds ?? [],
    windSuitable: stand ? suitsWind({ unitId: stand.unitId, name: stand.name, winds: stand.winds }, (s.windFrom as WindName | null) ?? null) : null,
    createdAt: s.createdAt.toISOString(),
  };
}
