/**
 * The demo's work in progress: Kettle Hollow Farm's proposal drafted, sent and approved through the
 * same commands the API uses (so its tasks are generated on approval), then some tasks assigned to
 * the demo crew around today's date and one finished with a photo. Idempotent.
 */
import fs from 'node:fs';
import path from 'node:path';
import { Op } from 'sequelize';
import { Property, Proposal, Task, User, type Firm } from '../../models';
import { draftProposal, sendProposal } from '../../commands/proposal-writer';
import { approveProposal } from '../../commands/proposal-approver';
import { completeTask, updateTask } from '../../commands/task-writer';
import { toSessionUser } from '../../services/auth/passport';
import { inspectPhoto } from '../../services/tasks/photo-intake';
import { addDays } from '../../../shared/domain/planting-windows';
import { firmToday } from '../../services/clock';

const PROPERTY = 'Kettle Hollow Farm';
const PHOTO = path.resolve(import.meta.dirname, 'assets/brassica-plot.jpg');

/**
 * Assignments: [task, unit, crew e-mail, days from today]. Dates are kept inside each task's window,
 * so the sheet shows one job overdue, one this week and later ones, without schedule warnings.
 */
const ASSIGNMENTS: [string, string, string, number][] = [
  ['Mark crop trees and cull trees', 'South slope bedding', 'crew@browseline.test', -3],
  ['Soil test', 'Hollow brassica plot', 'crew@browseline.test', 1],
  ['Hinge-cut selected trees', 'South slope bedding', 'crew@browseline.test', 13],
  ['Hack-and-squirt cull trees', 'South slope bedding', 'crew2@browseline.test', 14],
  ['Lime to the soil-test recommendation', 'Hollow brassica plot', 'crew2@browseline.test', 50],
];
/** The finished job: [task, unit, days ago]. */
const FINISHED: [string, string, number] = ['Soil test', 'Ridge clover plot', 2];

const clamp = (date: string, earliest: string, latest: string) => (date < earliest ? earliest : date > latest ? latest : date);

/** Approves the demo proposal (making its tasks) and puts some work on the crew's sheet. Answers the tasks made. */
export async function seedDemoSchedule(firm: Firm): Promise<number> {
  const property = await Property.findOne({ where: { firmId: firm.id, name: PROPERTY } });
  const consultant = await User.findOne({ where: { firmId: firm.id, role: 'consultant' } });
  const landowner = property ? await User.findOne({ where: { firmId: firm.id, clientId: property.clientId, role: 'client' }, order: [['id', 'ASC']] }) : null;
  if (!property || !consultant || !landowner) return 0;
  if (await Proposal.count({ where: { propertyId: property.id, status: 'approved' } })) return 0;

  const staff = await toSessionUser(consultant);
  const draft = await draftProposal(staff, property.id, { title: 'Kettle Hollow Farm — habitat plan, first season', depositPct: 30 }, null);
  await sendProposal(staff, draft.id, null);
  await approveProposal(await toSessionUser(landowner), draft.id, { signedName: landowner.name }, { ip: null, userAgent: 'demo seed' });

  const today = await firmToday(firm.id);
  const tasks = await Task.findAll({ where: { proposalId: draft.id }, order: [['position', 'ASC'], ['id', 'ASC']] });
  const crew = await User.findAll({ where: { firmId: firm.id, role: 'crew', email: { [Op.in]: ASSIGNMENTS.map((a) => a[2]) } } });
  const find = (name: string, unit: string) => tasks.find((t) => t.name === name && t.unitName === unit);
  for (const [name, unit, email, offset] of ASSIGNMENTS) {
    const task = find(name, unit);
    const member = crew.find((c) => c.email === email);
    if (!task || !member) continue;
    const start = clamp(addDays(today, offset), task.earliest, task.latest);
    await updateTask(staff, task.id, { assigneeId: member.id, startDate: start, endDate: start }, null);
  }
  // One finished job with a photo, so the schedule, the map and the portal show progress from the start.
  const finished = find(FINISHED[0], FINISHED[1]);
  const crewMember = crew.find((c) => c.email === 'crew@browseline.test');
  if (finished && crewMember) {
    const doneOn = addDays(today, -FINISHED[2]);
    await updateTask(staff, finished.id, { assigneeId: crewMember.id, startDate: doneOn, endDate: doneOn }, null);
    const photo = await inspectPhoto(fs.readFileSync(PHOTO), 'ridge-plot-soil-cores.jpg');
    await completeTask(await toSessionUser(crewMember), finished.id, { doneOn, notes: 'Twelve cores from 0–6 in., zig-zag across the plot; bagged and labelled for the lab.', hours: 1.5, quantitiesUsed: [] }, [photo], `demo-seed-${finished.id}`, null);
  }
  return tasks.length;
}
