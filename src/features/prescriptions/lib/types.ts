/** Prescription shapes on the client: the API's answer and the part of it the panel shows (also built by the live preview). */
import type { PrescriptionParameters } from '../../../../shared/domain/practice';
import type { PrescriptionResult } from '../../../../shared/domain/prescription-quantities';
import type { ScheduleResult, ScheduleWarning } from '../../../../shared/domain/planting-windows';
import type { UnitKind } from '../../../../shared/domain/unit-kinds';

/** The unit a prescription panel is for (what the plan ledger knows of it). */
export interface PanelUnit {
  id: number;
  kind: UnitKind;
  name: string;
  acres: number | null;
  lengthFt: number | null;
  perimeterFt: number | null;
}

export interface CautionDto {
  id: string;
  title: string;
  text: string;
}

/** What a prescription shows: quantities, purchases, lines, schedule, warnings, cautions, summary and cost. */
export type PrescriptionView = Omit<PrescriptionResult, 'practiceKey' | 'count'> & {
  schedule: ScheduleResult;
  warnings: ScheduleWarning[];
  cautions: CautionDto[];
  summary: string;
};

/** A prescription over the API (GET /api/prescriptions/:id and the lists). */
export type PrescriptionDto = PrescriptionView & {
  id: number;
  unitId: number;
  unitName: string | null;
  propertyId: number;
  practiceId: number;
  practiceName: string;
  year: number;
  targetDate: string | null;
  count: number | null;
  notes: string | null;
  parameters: PrescriptionParameters;
  createdAt: string;
  updatedAt: string;
};
