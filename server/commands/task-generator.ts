/**
 * Turns an approved proposal into work: one task per step of each prescription it sells, with the
 * step's window, quantities, cost share and cautions. Runs inside the approval's transaction.
 */
import type { Transaction } from 'sequelize';
import { Practice, Prescription, ProposalLine, Task, Unit, type Proposal } from '../models';
import { tasksFromPrescription } from '../../shared/domain/tasks';
import type { PracticeDefinition } from '../../shared/domain/practice';

/** The prescriptions a proposal sells: those on its required lines and on the options the client chose. */
async function soldPrescriptionIds(proposalId: number, transaction: Transaction): Promise<number[]> {
  const lines = await ProposalLine.findAll({ where: { proposalId }, attributes: ['prescriptionId', 'optional', 'selected'], transaction });
  return [...new Set(lines.filter((l) => l.prescriptionId !== null && (!l.optional || l.selected)).map((l) => l.prescriptionId as number))];
}

/** Creates the tasks of an approved proposal; steps that already have a task (from an earlier approval) are left alone. Answers the number created. */
export async function generateTasksForProposal(proposal: Proposal, transaction: Transaction): Promise<number> {
  const ids = await soldPrescriptionIds(proposal.id, transaction);
  if (ids.length === 0) return 0;
  const prescriptions = await Prescription.findAll({ where: { id: ids, firmId: proposal.firmId }, order: [['id', 'ASC']], transaction });
  const [practices, units] = await Promise.all([
    Practice.findAll({ where: { id: [...new Set(prescriptions.map((p) => p.practiceId))] }, transaction }),
    Unit.findAll({ where: { id: [...new Set(prescriptions.map((p) => p.unitId))] }, attributes: ['id', 'name'], transaction }),
  ]);
  const practiceById = new Map(practices.map((p) => [p.id, p]));
  const unitName = new Map(units.map((u) => [u.id, u.name]));
  const rows = prescriptions.flatMap((rx) => {
    const practice = practiceById.get(rx.practiceId);
    if (!practice) return [];
    const definition = practice.definition as PracticeDefinition;
    return tasksFromPrescription({ practice: definition, result: rx.result, steps: rx.schedule.steps }, rx.cautions).map((draft) => ({
      firmId: proposal.firmId,
      propertyId: rx.propertyId,
      unitId: rx.unitId,
      prescriptionId: rx.id,
      proposalId: proposal.id,
      stepKey: draft.stepKey,
      name: draft.name,
      kind: draft.kind,
      practiceName: definition.name ?? practice.name,
      unitName: unitName.get(rx.unitId) ?? 'Unit',
      dependsOn: draft.dependsOn,
      earliest: draft.earliest,
      latest: draft.latest,
      startDate: draft.startDate,
      endDate: draft.startDate,
      status: 'planned' as const,
      assigneeId: null,
      quantities: draft.quantities,
      cautions: draft.cautions,
      costCents: draft.costCents,
      position: draft.position,
    }));
  });
  if (rows.length === 0) return 0;
  const created = await Task.bulkCreate(rows, { transaction, ignoreDuplicates: true, returning: ['id'] });
  return created.filter((t) => t.id).length;
}
