/** The API routers and their mount paths under /api. Add new routers here. */
import type { Router } from 'express';
import { healthRouter } from './health';
import { authRouter } from './auth';
import { teamRouter } from './team';
import { clientsRouter } from './clients';
import { deskRouter } from './desk';
import { portalRouter } from './portal';
import { fieldRouter } from './field';
import { devMailRouter } from './dev-mail';
import { propertiesRouter } from './properties';
import { propertyUnitsRouter } from './property-units';
import { propertyImportsRouter } from './property-imports';
import { propertyExportsRouter } from './property-exports';
import { propertyPlanPdfRouter } from './property-plan-pdf';
import { unitsRouter } from './units';
import { firmRouter } from './firm';
import { signupRouter } from './signup';
import { signupPlacesRouter } from './signup-places';
import { placesRouter } from './places';
import { overlaysRouter, propertyOverlaysRouter } from './overlays';
import { materialsRouter, practicesRouter, ratesRouter } from './library';
import { prescriptionsRouter, propertyPrescriptionsRouter, unitPrescriptionsRouter } from './prescriptions';
import { propertyProposalsRouter, proposalsRouter } from './proposals';
import { propertyProgressRouter, taskPhotosRouter, tasksRouter } from './tasks';
import { calendarFeedsRouter, calendarRouter } from './calendar';
import { invoicesRouter } from './invoices';
import { webhooksRouter } from './webhooks';
import { harvestsRouter, propertyResultsRouter, seasonReportsRouter, surveysRouter } from './results';
import { filesRouter } from './files';
import { jobsRouter } from './jobs';
import { outboxRouter } from './outbox';
import { checksRouter, propertyPlotStatusesRouter, unitChecksRouter } from './checks';
import { propertySoilTestsRouter, soilTestsRouter, unitSoilTestsRouter } from './soil-tests';
import { soilTestContextRouter } from './soil-test-context';
import { sprayRecordsRouter } from './spray-records';
import { propertySeasonsRouter, seasonDraftsRouter } from './seasons';
import { propertySeasonComparisonRouter } from './season-comparison';
import { cameraRouters } from './cameras';
import { propertyCameraSitesRouter } from './camera-sites';
import { searchRouter } from './search';
import { firmExportsRouter } from './firm-exports';
import { observationPhotosRouter, propertyObservationsRouter } from './observations';
import { huntingRouter } from './hunting';

export const apiRouters: { path: string; router: Router }[] = [
  { path: '/health', router: healthRouter },
  { path: '/auth', router: authRouter },
  { path: '/team', router: teamRouter },
  { path: '/clients', router: clientsRouter },
  { path: '/desk', router: deskRouter },
  { path: '/portal', router: portalRouter },
  { path: '/field', router: fieldRouter },
  { path: '/dev/mail', router: devMailRouter },
  { path: '/properties', router: propertiesRouter },
  { path: '/properties', router: propertyUnitsRouter },
  { path: '/properties', router: propertyImportsRouter },
  { path: '/properties', router: propertyExportsRouter },
  { path: '/properties', router: propertyPlanPdfRouter },
  { path: '/properties', router: propertyOverlaysRouter },
  { path: '/units', router: unitsRouter },
  { path: '/firm', router: firmRouter },
  { path: '/signup/places', router: signupPlacesRouter },
  { path: '/signup', router: signupRouter },
  { path: '/places', router: placesRouter },
  { path: '/overlays', router: overlaysRouter },
  { path: '/materials', router: materialsRouter },
  { path: '/rates', router: ratesRouter },
  { path: '/practices', router: practicesRouter },
  { path: '/units', router: unitPrescriptionsRouter },
  { path: '/properties', router: propertyPrescriptionsRouter },
  { path: '/prescriptions', router: prescriptionsRouter },
  { path: '/properties', router: propertyProposalsRouter },
  { path: '/proposals', router: proposalsRouter },
  { path: '/tasks', router: tasksRouter },
  { path: '/task-photos', router: taskPhotosRouter },
  { path: '/properties', router: propertyProgressRouter },
  { path: '/calendar-feeds', router: calendarFeedsRouter },
  { path: '/calendar', router: calendarRouter },
  { path: '/invoices', router: invoicesRouter },
  { path: '/webhooks', router: webhooksRouter },
  { path: '/properties', router: propertyResultsRouter },
  { path: '/surveys', router: surveysRouter },
  { path: '/harvests', router: harvestsRouter },
  { path: '/season-reports', router: seasonReportsRouter },
  { path: '/files', router: filesRouter },
  { path: '/jobs', router: jobsRouter },
  { path: '/outbox', router: outboxRouter },
  { path: '/units', router: unitChecksRouter },
  { path: '/checks', router: checksRouter },
  { path: '/properties', router: propertyPlotStatusesRouter },
  { path: '/units', router: unitSoilTestsRouter },
  { path: '/properties', router: propertySoilTestsRouter },
  { path: '/properties', router: soilTestContextRouter },
  { path: '/soil-tests', router: soilTestsRouter },
  { path: '/properties', router: propertySeasonsRouter },
  { path: '/season-drafts', router: seasonDraftsRouter },
  { path: '/properties', router: propertySeasonComparisonRouter },
  ...cameraRouters,
  { path: '/search', router: searchRouter },
  { path: '/firm-exports', router: firmExportsRouter },
  { path: '/properties', router: propertyObservationsRouter },
  { path: '/observation-photos', router: observationPhotosRouter },
  { path: '', router: huntingRouter },
  { path: '/spray-records', router: sprayRecordsRouter },
  { path: '/properties', router: propertyCameraSitesRouter },
];
