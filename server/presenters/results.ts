/** JSON shapes of surveys, harvest records and season reports (types in shared/schemas/results.ts). */
import { cameraSurveyEstimates } from '../../shared/domain/survey-estimates';
import { seasonRange } from '../../shared/domain/season-results';
import type { CameraSiteDto, HarvestDto, SeasonReportDto, SurveyDto } from '../../shared/schemas/results';
import type { CameraSurvey, HarvestRecord, SeasonReport } from '../models';

const MS_PER_DAY = 86_400_000;

/** A survey with its estimates computed from the property's current acreage (null without an area). */
export function presentSurvey(survey: CameraSurvey, propertyAcres: number | null, cameraSites: readonly CameraSiteDto[]): SurveyDto {
  const siteName = new Map(cameraSites.map((c) => [c.id, c.name]));
  // A survey from photos states the area its cameras cover; a typed survey speaks for the property.
  const areaAcres = survey.areaAcres ?? propertyAcres;
  const result =
    areaAcres !== null && areaAcres > 0
      ? cameraSurveyEstimates({
          buckPhotos: survey.buckPhotos,
          uniqueBucks: survey.uniqueBucks,
          doePhotos: survey.doePhotos,
          fawnPhotos: survey.fawnPhotos,
          propertyAcres: areaAcres,
          cameraCount: survey.cameraCount,
          startDate: survey.startDate,
          endDate: survey.endDate,
        })
      : null;
  const surveyDays = Math.round((Date.parse(`${survey.endDate}T00:00:00Z`) - Date.parse(`${survey.startDate}T00:00:00Z`)) / MS_PER_DAY) + 1;
  return {
    id: survey.id,
    propertyId: survey.propertyId,
    name: survey.name,
    startDate: survey.startDate,
    endDate: survey.endDate,
    season: survey.season,
    buckPhotos: survey.buckPhotos,
    uniqueBucks: survey.uniqueBucks,
    doePhotos: survey.doePhotos,
    fawnPhotos: survey.fawnPhotos,
    bucks: survey.bucks,
    cameraUnitIds: survey.cameraUnitIds,
    cameras: survey.cameraUnitIds.map((id) => ({ id, name: siteName.get(id) ?? 'Camera site removed from the plan' })),
    cameraCount: survey.cameraCount,
    notes: survey.notes,
    areaAcres: areaAcres !== null && areaAcres > 0 ? areaAcres : null,
    fromPhotos: survey.fromPhotos ?? null,
    estimates: result?.estimates ?? null,
    display: result?.display ?? null,
    surveyDays: result?.surveyDays ?? surveyDays,
    acresPerCamera: result?.acresPerCamera ?? null,
    warnings: result?.warnings ?? [
      { code: 'no-area', severity: 'warning', message: 'The property has no measured area, so no estimate per square mile can be made: draw or import its boundary on the plan map.' },
    ],
    createdAt: survey.createdAt.toISOString(),
    updatedAt: survey.updatedAt.toISOString(),
  };
}

/** A harvest record with its unit's name. */
export function presentHarvest(record: HarvestRecord, unitNames: ReadonlyMap<number, string>): HarvestDto {
  return {
    id: record.id,
    propertyId: record.propertyId,
    date: record.date,
    season: record.season,
    sex: record.sex,
    ageClass: record.ageClass,
    dressedWeightLb: record.dressedWeightLb,
    antlerPoints: record.antlerPoints,
    unitId: record.unitId,
    unitName: record.unitId === null ? null : (unitNames.get(record.unitId) ?? null),
    stand: record.stand,
    hunter: record.hunter,
    notes: record.notes,
    standUnitId: record.standUnitId ?? null,
    standName: record.standUnitId ? (unitNames.get(record.standUnitId) ?? null) : null,
    sitId: record.sitId ?? null,
    diseaseSampleNumber: record.diseaseSampleNumber ?? null,
    createdAt: record.createdAt.toISOString(),
  };
}

/** A season report with the link to its PDF. */
export function presentSeasonReport(report: SeasonReport, byteSize: number): SeasonReportDto {
  return {
    id: report.id,
    propertyId: report.propertyId,
    season: report.season,
    seasonLabel: seasonRange(report.season).label,
    recommendations: report.recommendations,
    sentAt: report.sentAt?.toISOString() ?? null,
    sentTo: report.sentTo,
    withdrawnAt: report.withdrawnAt?.toISOString() ?? null,
    byteSize,
    pdfUrl: `/api/season-reports/${report.id}/pdf`,
    createdAt: report.createdAt.toISOString(),
  };
}
