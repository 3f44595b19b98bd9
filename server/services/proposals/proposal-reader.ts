/** Loads a proposal with everything its presenter and document need. */
import type { Transaction } from 'sequelize';
import { Client, Prescription, Property, Proposal, ProposalApproval, ProposalLine, Unit } from '../../models';
import { presentProposal, type ProposalContext } from '../../presenters/proposal';
import { firmToday } from '../clock';
import { priceProposal } from './pricing';

/** The context of a proposal: names, unit groups with prescription summaries, cautions. */
export async function proposalContext(p: Proposal, lines: ProposalLine[], transaction?: Transaction): Promise<ProposalContext> {
  // A sent version reads as it was sent: names, unit sizes, summaries and cautions from its snapshot.
  const frozen = p.planSnapshot?.context;
  if (frozen) return { propertyName: p.planSnapshot!.property.name, clientName: frozen.clientName, groups: frozen.groups, cautions: frozen.cautions, today: await firmToday(p.firmId, transaction) };
  const prescriptionIds = [...new Set(lines.map((l) => l.prescriptionId).filter((x): x is number => !!x))];
  const unitIds = [...new Set(lines.map((l) => l.unitId).filter((x): x is number => !!x))];
  const [property, client, prescriptions, units, today] = await Promise.all([
    Property.findByPk(p.propertyId, { attributes: ['name'], transaction }),
    Client.findByPk(p.clientId, { attributes: ['name'], transaction }),
    prescriptionIds.length ? Prescription.findAll({ where: { id: prescriptionIds }, transaction }) : Promise.resolve([] as Prescription[]),
    unitIds.length ? Unit.findAll({ where: { id: unitIds }, attributes: ['id', 'name', 'kind', 'acres', 'lengthFt'], transaction }) : Promise.resolve([] as Unit[]),
    firmToday(p.firmId, transaction),
  ]);
  const groups = new Map<string, ProposalContext['groups'][number]>();
  for (const line of lines) {
    if (groups.has(line.groupLabel)) continue;
    const unit = units.find((u) => u.id === line.unitId);
    groups.set(line.groupLabel, { unitId: unit?.id ?? null, label: line.groupLabel, kind: unit?.kind ?? null, acres: unit?.acres ?? null, lengthFt: unit?.lengthFt ?? null, summaries: [] });
  }
  for (const p2 of prescriptions) {
    const line = lines.find((l) => l.prescriptionId === p2.id);
    const group = line ? groups.get(line.groupLabel) : undefined;
    if (group && !group.summaries.includes(p2.summary)) group.summaries.push(p2.summary);
  }
  const cautions = new Map<string, ProposalContext['cautions'][number]>();
  for (const p2 of prescriptions) for (const c of p2.cautions) cautions.set(c.id, { id: c.id, title: c.title, text: c.text });
  return { propertyName: property?.name ?? '', clientName: client?.name ?? '', groups: [...groups.values()], cautions: [...cautions.values()], today };
}

/** The presented proposal by id (the caller has checked access). */
export async function readProposal(p: Proposal, transaction?: Transaction) {
  const [lines, approval] = await Promise.all([
    ProposalLine.findAll({ where: { proposalId: p.id }, order: [['position', 'ASC']], transaction }),
    ProposalApproval.findOne({ where: { proposalId: p.id }, transaction }),
  ]);
  return presentProposal(p, lines, priceProposal(p, lines), approval, await proposalContext(p, lines, transaction));
}
