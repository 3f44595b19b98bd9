/** The signed-in user as a session carries it: the raw row read with the session, and its session view. */
import { usableZone } from '../clock';
import { firmSettingsFrom, type RequestFirmSettings } from '../firm/request-firm-settings';
import type { SessionUser } from '../../../shared/schemas/auth';

/** One row of SESSION_USER_COLUMNS (session-store.ts). */
export interface SessionUserRow {
  id: number;
  email: string;
  name: string;
  role: SessionUser['role'];
  firmId: number;
  clientId: number | null;
  firmName: string;
  firmTimezone: string | null;
  firmAreaUnit: string | null;
  firmLengthUnit: string | null;
  firmTileUrlTemplate: string | null;
  firmIdleTimeoutHours: string | null;
}

/** The firm's display units from its settings (anything unknown reads as acres and feet). */
function sessionUnits(area: unknown, length: unknown): Pick<SessionUser, 'firmAreaUnit' | 'firmLengthUnit'> {
  return { firmAreaUnit: area === 'hectares' ? 'hectares' : 'acres', firmLengthUnit: length === 'metres' ? 'metres' : 'feet' };
}

/** The session view of a row. */
export function sessionUserOf(row: SessionUserRow): SessionUser {
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    role: row.role,
    firmId: row.firmId,
    firmName: row.firmName,
    firmTimezone: usableZone(row.firmTimezone),
    ...sessionUnits(row.firmAreaUnit, row.firmLengthUnit),
    clientId: row.clientId,
  };
}

/** The firm settings every answer needs, from a row. */
export const firmSettingsOf = (row: SessionUserRow): RequestFirmSettings => firmSettingsFrom(row.firmTileUrlTemplate, row.firmIdleTimeoutHours);
