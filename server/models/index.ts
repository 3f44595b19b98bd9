/** All models and their associations. Import models from here. */
import { Firm } from './firm';
import { Client } from './client';
import { User } from './user';
import { Property } from './property';
import { AuthToken } from './auth-token';
import { OutboxMessage } from './outbox-message';
import { BackgroundJob } from './background-job';
import { AuditEvent } from './audit-event';
import { Unit } from './unit';
import { Overlay } from './overlay';
import { Material, Practice, ServiceRateEntry } from './library';
import { Prescription } from './prescription';
import { Proposal, ProposalApproval, ProposalLine } from './proposal';
import { CalendarFeed, Task, TaskPhoto } from './task';
import { SharedFile } from './shared-file';
import { Invoice, InvoiceLine, InvoicePayment, InvoiceRefund } from './invoice';
import { CameraSurvey, HarvestRecord, SeasonReport } from './results';

Firm.hasMany(User, { foreignKey: 'firmId' });
User.belongsTo(Firm, { foreignKey: 'firmId' });
Firm.hasMany(Client, { foreignKey: 'firmId' });
Client.belongsTo(Firm, { foreignKey: 'firmId' });
Client.hasMany(Property, { foreignKey: 'clientId', as: 'properties' });
Property.belongsTo(Client, { foreignKey: 'clientId', as: 'client' });
Client.hasMany(User, { foreignKey: 'clientId', as: 'contacts' });
User.belongsTo(Client, { foreignKey: 'clientId', as: 'client' });
AuthToken.belongsTo(User, { foreignKey: 'userId' });
Property.hasMany(Unit, { foreignKey: 'propertyId', as: 'units' });
Unit.belongsTo(Property, { foreignKey: 'propertyId', as: 'property' });
Property.hasMany(Overlay, { foreignKey: 'propertyId', as: 'overlays' });
Unit.hasMany(Prescription, { foreignKey: 'unitId', as: 'prescriptions' });
Prescription.belongsTo(Unit, { foreignKey: 'unitId', as: 'unit' });
Prescription.belongsTo(Practice, { foreignKey: 'practiceId', as: 'practice' });
Proposal.hasMany(ProposalLine, { foreignKey: 'proposalId', as: 'lines' });
Proposal.hasOne(ProposalApproval, { foreignKey: 'proposalId', as: 'approval' });
Task.hasMany(TaskPhoto, { foreignKey: 'taskId', as: 'photos' });
TaskPhoto.belongsTo(Task, { foreignKey: 'taskId', as: 'task' });
Invoice.hasMany(InvoiceLine, { foreignKey: 'invoiceId', as: 'lines' });
Invoice.hasMany(InvoicePayment, { foreignKey: 'invoiceId', as: 'payments' });

SeasonReport.belongsTo(SharedFile, { foreignKey: 'sharedFileId', as: 'file' });

export { Firm, Client, User, Property, AuthToken, OutboxMessage, AuditEvent, Unit, Overlay, Material, ServiceRateEntry, Practice, Prescription, Proposal, ProposalLine, ProposalApproval, Task, TaskPhoto, CalendarFeed, SharedFile, Invoice, InvoiceLine, InvoicePayment, InvoiceRefund, CameraSurvey, HarvestRecord, SeasonReport, BackgroundJob };
export type { SharedFileCategory } from './shared-file';
export type { ProposalStatus } from './proposal';
export type { Corners } from './overlay';
export type { OutboxAttachment } from './outbox-message';
export type { InvoiceDocumentSnapshot } from './invoice';
