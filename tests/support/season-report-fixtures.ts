/**
 * Invented season-report content for document tests: Kettle Hollow Farm's 2025–26 season with one
 * yearling doe taken, no finished work, no survey and no checks. Tests spread it and add their part.
 */
import type { SeasonReportDocumentInput } from '../../templates/documents/season-report';
import { harvestSummary } from '../../shared/domain/survey-estimates';

/** A fresh season-report input that has only a harvest in it. */
export const onlyAHarvest = (): SeasonReportDocumentInput => ({
  firm: { name: 'Fernhill Habitat Consulting', phone: null, email: null },
  client: { name: 'Okonkwo-Larsen Family' },
  property: { name: 'Kettle Hollow Farm', acres: 160, locality: null },
  season: { label: '2025–26', startsOn: '2025-07-01', endsOn: '2026-06-30' },
  preparedOn: '2026-07-02',
  work: [],
  acresEstablished: 0,
  unitsEstablished: [],
  photos: [],
  surveys: [],
  surveyTrend: [],
  harvest: harvestSummary([{ date: '2025-12-13', sex: 'doe', ageClass: '1.5', dressedWeightLb: 81 }]),
  harvestTrend: [],
  recommendations: null,
  cautions: [],
});
