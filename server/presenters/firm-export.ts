import type { BackgroundJob } from '../models';
import type { FirmExport } from '../models/firm-export';
import type { FirmExportDto } from '../../shared/schemas/firm-export';

/** A whole-firm export with its job's progress; failed when its job has given up. */
export function presentFirmExport(record: FirmExport, job: BackgroundJob | null): FirmExportDto {
  const failed = record.status === 'failed' || (record.status === 'building' && job?.status === 'failed');
  const ready = record.status === 'ready';
  return {
    id: record.id,
    status: failed ? 'failed' : record.status,
    progress: ready ? 100 : (job?.progress ?? 0),
    step: ready ? null : (job?.step ?? null),
    jobId: record.jobId,
    jobStatus: job?.status ?? null,
    error: failed ? (job?.lastError ?? 'The export stopped with an error.') : null,
    byteSize: record.byteSize,
    fileCount: record.fileCount,
    downloadUrl: ready ? `/api/firm-exports/${record.id}/download` : null,
    createdAt: record.createdAt.toISOString(),
    finishedAt: record.finishedAt ? record.finishedAt.toISOString() : null,
  };
}
