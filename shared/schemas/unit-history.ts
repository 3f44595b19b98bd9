/** A unit's record per season: what was prescribed, what was done and used, checks, soil tests and how many observations were logged on it. */
import type { UnitCheckDto } from './checks';
import type { SoilTestDto } from './soil-tests';
import type { TaskQuantityUsed } from '../domain/tasks';

export interface UnitHistorySeasonDto {
  season: number;
  prescriptions: { id: number; practiceName: string; summary: string; totalCents: number; notes: string | null }[];
  work: { taskId: number; name: string; status: string; doneOn: string | null; quantitiesUsed: TaskQuantityUsed[] }[];
  checks: UnitCheckDto[];
  soilTests: SoilTestDto[];
  /** Field observations logged on the unit that season (the year of observed_at in the firm's time zone). */
  observations: number;
}

export interface UnitHistoryDto {
  unitId: number;
  unitName: string;
  kind: string;
  /** Newest season first. */
  seasons: UnitHistorySeasonDto[];
}
