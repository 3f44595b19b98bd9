/**
 * A camera survey made from the tagged photos of chosen deployments and dates: buck, doe and fawn
 * photos and the identified bucks come from the tags and feed the camera census estimates; the
 * density refers to the area the cameras cover (about 100 acres each, capped at the property).
 */
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db/sequelize';
import { Buck, CameraDeployment, CameraSurvey, Property } from '../models';
import { findInFirm } from '../policies/firm-scope';
import { unprocessable } from '../errors';
import { recordAudit } from './audit-recorder';
import { cameraSettings } from '../queries/camera-fleet';
import { cameraNights, surveyAreaAcres, talliesFromPhotos, type CameraTag } from '../../shared/domain/camera-events';
import { cameraSurveyEstimates, huntingSeasonOf } from '../../shared/domain/survey-estimates';
import { formatDateSpan } from '../../shared/domain/clock';
import type { SurveyFromPhotosSchema } from '../../shared/schemas/cameras';
import type { IdentifiedBuck } from '../../shared/schemas/results';
import type { SessionUser } from '../../shared/schemas/auth';
import type { z } from 'zod';

/** Records a survey tallied from tagged photos; refuses (422) what the method cannot estimate, saying what to tag. */
export async function createSurveyFromPhotos(actor: SessionUser, propertyId: number, values: z.output<typeof SurveyFromPhotosSchema>, ip: string | null): Promise<{ survey: CameraSurvey; property: Property }> {
  return sequelize.transaction(async (transaction) => {
    const property = await findInFirm(Property, propertyId, actor.firmId, 'That property', { transaction });
    if (property.acres === null || property.acres <= 0) throw unprocessable('This property has no measured area yet: draw or import its boundary on the plan map, so deer per square mile can be estimated.');
    const { deploymentIds, from, to } = values.fromPhotos;
    const deployments = await CameraDeployment.findAll({ where: { id: deploymentIds, firmId: actor.firmId, propertyId }, transaction });
    const missing = deploymentIds.filter((id) => !deployments.some((d) => d.id === id));
    if (missing.length) throw unprocessable(`fromPhotos.deploymentIds: deployment ${missing.join(', ')} is not on this property. Pick deployments of this property’s cameras.`, [{ path: 'fromPhotos.deploymentIds', message: 'not on this property' }]);
    const idle = deployments.filter((d) => cameraNights(d.startedOn, d.endedOn ?? '9999-12-31', { from, to }) === 0);
    if (idle.length) throw unprocessable(`fromPhotos: deployment ${idle.map((d) => d.id).join(', ')} did not run between ${formatDateSpan(from, to)}. Pick the dates its camera ran.`, [{ path: 'fromPhotos', message: 'no nights in the window' }]);

    const { zone } = await cameraSettings(actor.firmId, transaction);
    const photos = await sequelize.query<{ tag: CameraTag; buck_id: number | null }>(
      `SELECT tag, buck_id FROM camera_photos
       WHERE deployment_id IN (:ids) AND tag IN ('buck','doe','fawn') AND taken_at IS NOT NULL AND NOT flags ? 'time-out-of-range'
         AND (taken_at AT TIME ZONE :zone)::date BETWEEN :from AND :to`,
      { replacements: { ids: deploymentIds, zone, from, to }, type: QueryTypes.SELECT, transaction },
    );
    const tallies = talliesFromPhotos(photos.map((p) => ({ tag: p.tag, buckId: p.buck_id })));
    if (tallies.buckPhotos === 0) throw unprocessable(`No photo of these deployments between ${formatDateSpan(from, to)} is tagged buck. Tag the deer on their photos first.`);
    if (tallies.uniqueBucks === 0) throw unprocessable('No buck photo names a buck from the roster: the method needs the bucks you can tell apart. Pick the buck on its photos (Buck roster) and make the survey again.');

    const cameraCount = new Set(deployments.map((d) => d.cameraId)).size;
    const cameraUnitIds = [...new Set(deployments.map((d) => d.unitId))];
    const areaAcres = Math.min(values.areaAcres ?? surveyAreaAcres(cameraCount, property.acres), property.acres);
    // Check the tallies with the method before anything is written (DomainValidationError → 422).
    cameraSurveyEstimates({ ...tallies, propertyAcres: areaAcres, cameraCount, startDate: from, endDate: to });

    const season = huntingSeasonOf(from, 'fromPhotos.from');
    const seen = [...new Set(photos.map((p) => p.buck_id).filter((id): id is number => id !== null))];
    const roster = await Buck.findAll({ where: { id: seen }, transaction });
    const bucks: IdentifiedBuck[] = [];
    for (const b of roster) {
      const age = b.ageEstimates.find((a) => a.season === season);
      if (age) bucks.push({ label: b.name, ageClass: age.ageClass });
    }
    const survey = await CameraSurvey.create(
      {
        firmId: actor.firmId,
        propertyId,
        name: values.name,
        startDate: from,
        endDate: to,
        season,
        ...tallies,
        // The survey lists its bucks only when every one has an age class for the season.
        bucks: bucks.length === tallies.uniqueBucks ? bucks : [],
        cameraUnitIds,
        cameraCount,
        areaAcres,
        fromPhotos: { deploymentIds, from, to },
        notes: values.notes ?? null,
        createdById: actor.id,
      },
      { transaction },
    );
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'survey.created', subjectType: 'CameraSurvey', subjectId: survey.id, data: { propertyId, fromPhotos: { deploymentIds, from, to } }, ip }, transaction);
    return { survey, property };
  });
}
