/** Reads of spray records: a firm's season, optionally one property, oldest application first. */
import { Op } from 'sequelize';
import { SprayRecord } from '../models/spray-record';
import { keepUntil } from '../../shared/domain/spray-records';
import type { SprayRecordDto } from '../../shared/schemas/spray-records';

/** A stored record as the API answers it. */
export function presentSprayRecord(r: SprayRecord): SprayRecordDto {
  return {
    id: r.id,
    taskId: r.taskId,
    propertyId: r.propertyId,
    unitId: r.unitId,
    appliedOn: r.appliedOn,
    keepUntil: keepUntil(r.appliedOn),
    propertyName: r.propertyName,
    unitName: r.unitName,
    latitude: r.latitude,
    longitude: r.longitude,
    cropOrSite: r.cropOrSite,
    areaTreated: r.areaTreated,
    areaUnit: r.areaUnit,
    productName: r.productName,
    epaRegNo: r.epaRegNo,
    restrictedUse: r.restrictedUse,
    amount: r.amount,
    amountUnit: r.amountUnit,
    applicatorName: r.applicatorName,
    applicatorCertNo: r.applicatorCertNo,
    windMph: r.windMph,
    windDirection: r.windDirection,
    airTempF: r.airTempF,
  };
}

/** The firm's spray records applied in the calendar year `season`, for one property when given. */
export async function listSprayRecords(firmId: number, season: number, propertyId?: number): Promise<SprayRecordDto[]> {
  const rows = await SprayRecord.findAll({
    where: { firmId, appliedOn: { [Op.between]: [`${season}-01-01`, `${season}-12-31`] }, ...(propertyId ? { propertyId } : {}) },
    order: [['appliedOn', 'ASC'], ['id', 'ASC']],
  });
  return rows.map(presentSprayRecord);
}
