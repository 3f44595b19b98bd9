/** Writes the camera fleet: cameras, deployments (ending the running one when a camera moves), card pulls and the buck roster. */
import { Op, type Transaction } from 'sequelize';
import type { z } from 'zod';
import { sequelize } from '../db/sequelize';
import { Buck, Camera, CameraDeployment, CameraPhoto, CardPull, Property, Unit } from '../models';
import { findInFirm } from '../policies/firm-scope';
import { conflict, unprocessable } from '../errors';
import { recordAudit } from './audit-recorder';
import { firmToday } from '../services/clock';
import { cameraSettings } from '../queries/camera-fleet';
import { formatDate } from '../../shared/domain/clock';
import { correctedPhotoTime } from '../../shared/domain/camera-events';
import { photoTimeFlags } from './camera-photo-writer';
import type { BuckCreateSchema, BuckUpdateSchema, CameraCreateSchema, CameraUpdateSchema, CardPullCreateSchema, DeploymentCreateSchema, DeploymentUpdateSchema } from '../../shared/schemas/cameras';
import type { SessionUser } from '../../shared/schemas/auth';

type Out<S extends z.ZodType> = z.output<S>;

/** Adds a camera to the firm's fleet (labels are unique within the firm: 409 otherwise). */
export async function createCamera(actor: SessionUser, values: Out<typeof CameraCreateSchema>, ip: string | null): Promise<Camera> {
  return sequelize.transaction(async (transaction) => {
    const taken = await Camera.findOne({ where: { firmId: actor.firmId, label: values.label }, attributes: ['id'], transaction });
    if (taken) throw conflict(`label: the firm already has a camera labelled “${values.label}”. Give this one another label, e.g. with its serial number.`, [{ path: 'label', message: 'already used' }]);
    const camera = await Camera.create({ firmId: actor.firmId, label: values.label, serial: values.serial ?? null, retiredAt: null, createdById: actor.id }, { transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'camera.created', subjectType: 'Camera', subjectId: camera.id, ip }, transaction);
    return camera;
  });
}

/** Renames or retires a camera; a camera still deployed cannot be retired. */
export async function updateCamera(actor: SessionUser, id: number, values: Out<typeof CameraUpdateSchema>, ip: string | null): Promise<Camera> {
  return sequelize.transaction(async (transaction) => {
    const camera = await findInFirm(Camera, id, actor.firmId, 'That camera', { transaction, lock: true });
    if (values.label && values.label !== camera.label) {
      const taken = await Camera.findOne({ where: { firmId: actor.firmId, label: values.label, id: { [Op.ne]: id } }, attributes: ['id'], transaction });
      if (taken) throw conflict(`label: the firm already has a camera labelled “${values.label}”.`, [{ path: 'label', message: 'already used' }]);
    }
    if (values.retired) {
      const running = await CameraDeployment.findOne({ where: { cameraId: id, endedOn: null }, attributes: ['id'], transaction });
      if (running) throw conflict('This camera is still deployed: end its deployment (the day it was taken down) before retiring it.');
    }
    await camera.update(
      {
        ...(values.label ? { label: values.label } : {}),
        ...(values.serial !== undefined ? { serial: values.serial } : {}),
        ...(values.retired !== undefined ? { retiredAt: values.retired ? (camera.retiredAt ?? new Date()) : null } : {}),
      },
      { transaction },
    );
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'camera.updated', subjectType: 'Camera', subjectId: id, data: { fields: Object.keys(values) }, ip }, transaction);
    return camera;
  });
}

async function cameraSite(firmId: number, unitId: number, transaction: Transaction): Promise<Unit> {
  const unit = await Unit.findOne({ where: { id: unitId, firmId }, transaction });
  if (!unit) throw unprocessable('unitId: that camera site is not on any of your plans. Add the camera site on the property’s plan map first.', [{ path: 'unitId', message: 'not found' }]);
  if (unit.kind !== 'camera-site') throw unprocessable(`unitId: “${unit.name}” is not a camera site. Pick a plan unit of kind camera site.`, [{ path: 'unitId', message: 'not a camera site' }]);
  return unit;
}

/**
 * Sets a camera at a camera-site unit. When the camera is still running elsewhere, that deployment
 * ends on the new start day (the camera was moved), in the same transaction.
 */
export async function createDeployment(actor: SessionUser, cameraId: number, values: Out<typeof DeploymentCreateSchema>, ip: string | null): Promise<{ deployment: CameraDeployment; ended: CameraDeployment | null }> {
  return sequelize.transaction(async (transaction) => {
    const camera = await findInFirm(Camera, cameraId, actor.firmId, 'That camera', { transaction, lock: true });
    if (camera.retiredAt) throw conflict(`“${camera.label}” is retired. Bring it back into the fleet before deploying it.`);
    const unit = await cameraSite(actor.firmId, values.unitId, transaction);
    const today = await firmToday(actor.firmId, transaction);
    if (values.startedOn > today) throw unprocessable(`startedOn: ${formatDate(values.startedOn)} is in the future. Enter the day the camera was set.`, [{ path: 'startedOn', message: 'in the future' }]);
    const running = await CameraDeployment.findOne({ where: { cameraId, endedOn: null }, transaction, lock: transaction.LOCK.UPDATE });
    if (running) {
      if (values.startedOn < running.startedOn) {
        throw unprocessable(`startedOn: “${camera.label}” has been running since ${formatDate(running.startedOn)}; a new deployment must start on or after that day (the day it was moved).`, [{ path: 'startedOn', message: 'before the running deployment' }]);
      }
      await running.update({ endedOn: values.startedOn }, { transaction });
      await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'deployment.ended', subjectType: 'CameraDeployment', subjectId: running.id, data: { endedOn: values.startedOn, movedTo: unit.id }, ip }, transaction);
    }
    const deployment = await CameraDeployment.create(
      { firmId: actor.firmId, cameraId, propertyId: unit.propertyId, unitId: unit.id, startedOn: values.startedOn, endedOn: null, mode: values.mode, notes: values.notes ?? null, clockOffsetSeconds: values.clockOffsetSeconds ?? 0, createdById: actor.id },
      { transaction },
    );
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'deployment.created', subjectType: 'CameraDeployment', subjectId: deployment.id, data: { cameraId, unitId: unit.id }, ip }, transaction);
    return { deployment, ended: running };
  });
}

/** Ends a deployment or corrects its clock offset (its photos' times follow) or notes. */
export async function updateDeployment(actor: SessionUser, id: number, values: Out<typeof DeploymentUpdateSchema>, ip: string | null): Promise<CameraDeployment> {
  return sequelize.transaction(async (transaction) => {
    const deployment = await findInFirm(CameraDeployment, id, actor.firmId, 'That deployment', { transaction, lock: true });
    if (values.endedOn !== undefined) {
      if (deployment.endedOn && deployment.endedOn !== values.endedOn) throw conflict(`This deployment ended on ${formatDate(deployment.endedOn)} already.`);
      if (values.endedOn < deployment.startedOn) throw unprocessable(`endedOn: the camera was set on ${formatDate(deployment.startedOn)}; it cannot come down before.`, [{ path: 'endedOn', message: 'before the start' }]);
      if (values.endedOn > (await firmToday(actor.firmId, transaction))) throw unprocessable(`endedOn: ${formatDate(values.endedOn)} is in the future. End the deployment on the day the camera comes down.`, [{ path: 'endedOn', message: 'in the future' }]);
    }
    const offsetChanged = values.clockOffsetSeconds !== undefined && values.clockOffsetSeconds !== deployment.clockOffsetSeconds;
    await deployment.update(
      {
        ...(values.endedOn !== undefined ? { endedOn: values.endedOn } : {}),
        ...(values.clockOffsetSeconds !== undefined ? { clockOffsetSeconds: values.clockOffsetSeconds } : {}),
        ...(values.notes !== undefined ? { notes: values.notes } : {}),
      },
      { transaction },
    );
    if (offsetChanged) await retimePhotos(deployment, transaction);
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'deployment.updated', subjectType: 'CameraDeployment', subjectId: id, data: { fields: Object.keys(values) }, ip }, transaction);
    return deployment;
  });
}

/** Recomputes the true time (and its flags) of every photo of a deployment after its clock offset changed. */
async function retimePhotos(deployment: CameraDeployment, transaction: Transaction): Promise<void> {
  const { zone } = await cameraSettings(deployment.firmId, transaction);
  const now = new Date();
  const photos = await CameraPhoto.findAll({ where: { deploymentId: deployment.id, cameraTime: { [Op.ne]: null } }, attributes: ['id', 'cameraTime', 'cameraOffset', 'flags'], transaction });
  for (const photo of photos) {
    const takenAt = correctedPhotoTime(photo.cameraTime!, photo.cameraOffset, zone, deployment.clockOffsetSeconds);
    if (!takenAt) continue;
    const flags = [...photo.flags.filter((f) => f !== 'time-out-of-range' && f !== 'no-time'), ...photoTimeFlags(takenAt, deployment, now)];
    await CameraPhoto.update({ takenAt, flags }, { where: { id: photo.id }, transaction });
  }
}

/** Records a card pull on a deployment (on or after it started, not in the future, not after it ended). */
export async function createPull(actor: SessionUser, deploymentId: number, values: Out<typeof CardPullCreateSchema>, ip: string | null): Promise<CardPull> {
  return sequelize.transaction(async (transaction) => {
    const deployment = await findInFirm(CameraDeployment, deploymentId, actor.firmId, 'That deployment', { transaction, lock: true });
    if (values.pulledOn < deployment.startedOn) throw unprocessable(`pulledOn: the camera was set on ${formatDate(deployment.startedOn)}; its card cannot be pulled before.`, [{ path: 'pulledOn', message: 'before the start' }]);
    if (deployment.endedOn && values.pulledOn > deployment.endedOn) throw unprocessable(`pulledOn: this deployment ended on ${formatDate(deployment.endedOn)}; record a pull on or before that day.`, [{ path: 'pulledOn', message: 'after the end' }]);
    if (values.pulledOn > (await firmToday(actor.firmId, transaction))) throw unprocessable(`pulledOn: ${formatDate(values.pulledOn)} is in the future. Record the pull on the day the card came out.`, [{ path: 'pulledOn', message: 'in the future' }]);
    const pull = await CardPull.create({ firmId: actor.firmId, deploymentId, pulledOn: values.pulledOn, batteryPct: values.batteryPct ?? null, photoCount: values.photoCount ?? null, notes: values.notes ?? null, createdById: actor.id }, { transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'card-pull.created', subjectType: 'CardPull', subjectId: pull.id, data: { deploymentId }, ip }, transaction);
    return pull;
  });
}

/** Adds a buck to a property's roster (names are unique per property: 409). */
export async function createBuck(actor: SessionUser, propertyId: number, values: Out<typeof BuckCreateSchema>, ip: string | null): Promise<Buck> {
  return sequelize.transaction(async (transaction) => {
    await findInFirm(Property, propertyId, actor.firmId, 'That property', { transaction });
    const taken = await Buck.findOne({ where: { propertyId, name: values.name }, attributes: ['id'], transaction });
    if (taken) throw conflict(`name: the roster already has a buck named “${values.name}”. Pick another name.`, [{ path: 'name', message: 'already used' }]);
    const buck = await Buck.create({ firmId: actor.firmId, propertyId, name: values.name, notes: values.notes ?? null, ageEstimates: values.ageEstimates ?? [] }, { transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'buck.created', subjectType: 'Buck', subjectId: buck.id, data: { propertyId }, ip }, transaction);
    return buck;
  });
}

/** Renames a buck, changes its notes or its age estimates (one per season). */
export async function updateBuck(actor: SessionUser, propertyId: number, buckId: number, values: Out<typeof BuckUpdateSchema>, ip: string | null): Promise<Buck> {
  return sequelize.transaction(async (transaction) => {
    const buck = await findInFirm(Buck, buckId, actor.firmId, 'That buck', { transaction, lock: true });
    if (buck.propertyId !== propertyId) throw unprocessable('That buck is on another property’s roster.');
    if (values.ageEstimates) {
      const seasons = values.ageEstimates.map((a) => a.season);
      if (new Set(seasons).size !== seasons.length) throw unprocessable('ageEstimates: give one age class per season.', [{ path: 'ageEstimates', message: 'season twice' }]);
    }
    if (values.name && values.name !== buck.name) {
      const taken = await Buck.findOne({ where: { propertyId, name: values.name, id: { [Op.ne]: buckId } }, attributes: ['id'], transaction });
      if (taken) throw conflict(`name: the roster already has a buck named “${values.name}”.`, [{ path: 'name', message: 'already used' }]);
    }
    await buck.update({ ...(values.name ? { name: values.name } : {}), ...(values.notes !== undefined ? { notes: values.notes } : {}), ...(values.ageEstimates ? { ageEstimates: values.ageEstimates } : {}) }, { transaction });
    await recordAudit({ firmId: actor.firmId, userId: actor.id, action: 'buck.updated', subjectType: 'Buck', subjectId: buckId, data: { fields: Object.keys(values) }, ip }, transaction);
    return buck;
  });
}
