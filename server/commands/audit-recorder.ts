import type { Transaction } from 'sequelize';
import { AuditEvent } from '../models';

interface AuditInput {
  firmId: number | null;
  userId: number | null;
  action: string;
  subjectType?: string;
  subjectId?: number;
  data?: Record<string, unknown>;
  ip?: string | null;
}

/** Records who did what to which record, inside the caller's transaction. */
export async function recordAudit(input: AuditInput, transaction?: Transaction): Promise<void> {
  await AuditEvent.create(
    {
      firmId: input.firmId,
      userId: input.userId,
      action: input.action,
      subjectType: input.subjectType ?? null,
      subjectId: input.subjectId ?? null,
      data: input.data ?? {},
      ip: input.ip ?? null,
    },
    { transaction },
  );
}
