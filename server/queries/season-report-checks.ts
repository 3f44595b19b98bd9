/**
 * The season report's checks and soil tests: the checks made within the season's dates, and the
 * latest soil test of each unit sampled on or before the season's end (the soil as it stands).
 */
import { Op, type Transaction } from 'sequelize';
import { Unit, type Property } from '../models';
import { UnitCheck } from '../models/unit-check';
import { SoilTest } from '../models/soil-test';
import type { BrowseResult, EstablishmentResult, TimberResult } from '../../shared/domain/plot-checks';
import type { SeasonReportChecks } from '../../templates/documents/season-report-checks';

/** Checks between `startsOn` and `endsOn` and the latest soil test per unit up to `endsOn`, by unit name and date. */
export async function readSeasonReportChecks(property: Property, startsOn: string, endsOn: string, transaction?: Transaction): Promise<SeasonReportChecks> {
  const where = { propertyId: property.id, firmId: property.firmId };
  const [units, checks, tests] = await Promise.all([
    Unit.findAll({ where, attributes: ['id', 'name'], transaction }),
    UnitCheck.findAll({ where: { ...where, checkedOn: { [Op.between]: [startsOn, endsOn] } }, order: [['checkedOn', 'ASC'], ['id', 'ASC']], transaction }),
    SoilTest.findAll({ where: { ...where, sampledOn: { [Op.lte]: endsOn } }, order: [['sampledOn', 'ASC'], ['id', 'ASC']], transaction }),
  ]);
  const name = new Map(units.map((u) => [u.id, u.name]));
  const byName = <T extends { unitName: string }>(rows: T[]) => rows.sort((a, b) => a.unitName.localeCompare(b.unitName));
  const out: SeasonReportChecks = { establishment: [], browse: [], timber: [], soilTests: [] };
  for (const c of checks) {
    const unitName = name.get(c.unitId) ?? '';
    if (c.kind === 'establishment') {
      const r = c.result as unknown as EstablishmentResult;
      out.establishment.push({ unitName, checkedOn: c.checkedOn, status: r.status, groundCoverPct: Number(c.input.groundCoverPct ?? 0), species: r.species });
    } else if (c.kind === 'browse') {
      const r = c.result as unknown as BrowseResult;
      out.browse.push({ unitName, checkedOn: c.checkedOn, overallUsePct: r.overallUsePct, species: r.species });
    } else {
      const r = c.result as unknown as TimberResult;
      out.timber.push({ unitName, checkedOn: c.checkedOn, basalAreaSqFtPerAcre: r.basalAreaSqFtPerAcre, targetResidualBaSqFtPerAcre: r.targetResidualBaSqFtPerAcre, treesPerAcre: r.treesPerAcre });
    }
  }
  const latest = new Map<number, SoilTest>();
  for (const t of tests) latest.set(t.unitId, t);
  for (const t of latest.values()) {
    const rec = t.recommendation;
    out.soilTests.push({
      unitName: name.get(t.unitId) ?? '',
      sampledOn: t.sampledOn,
      lab: t.lab,
      ph: Number(t.ph),
      pPpm: t.pPpm === null ? null : Number(t.pPpm),
      kPpm: t.kPpm === null ? null : Number(t.kPpm),
      limeTonsPerAcre: rec.lime.tonsPerAcre,
      p2o5LbPerAcre: rec.nutrients.p2o5LbPerAcre,
      k2oLbPerAcre: rec.nutrients.k2oLbPerAcre,
      limeSource: rec.lime.source,
      nutrientSource: rec.nutrients.source,
    });
  }
  byName(out.establishment);
  byName(out.browse);
  byName(out.timber);
  byName(out.soilTests);
  return out;
}
