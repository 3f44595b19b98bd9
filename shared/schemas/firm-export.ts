/** The whole-firm export ("Take your data with you") as the API shows it. */
import { z } from 'zod';
import { JOB_STATUSES } from './job';
import { IdParamsSchema } from './common';

export const FIRM_EXPORT_STATUSES = ['building', 'ready', 'failed'] as const;
export type FirmExportStatus = (typeof FIRM_EXPORT_STATUSES)[number];

export const FirmExportIdParamsSchema = IdParamsSchema;

export const FirmExportSchema = z.object({
  id: z.number().int(),
  status: z.enum(FIRM_EXPORT_STATUSES),
  /** 0–100 while building, from the background job. */
  progress: z.number().int().min(0).max(100),
  /** The step under way ("Clients", "Files 12 of 40"), or null. */
  step: z.string().nullable(),
  jobId: z.string().nullable(),
  jobStatus: z.enum(JOB_STATUSES).nullable(),
  /** The job's last error sentence when it failed. */
  error: z.string().nullable(),
  byteSize: z.number().int().nullable(),
  fileCount: z.number().int().nullable(),
  /** Where the owner downloads the zip (firm-scoped; owner only), once ready. */
  downloadUrl: z.string().nullable(),
  createdAt: z.string(),
  finishedAt: z.string().nullable(),
});
export type FirmExportDto = z.infer<typeof FirmExportSchema>;
