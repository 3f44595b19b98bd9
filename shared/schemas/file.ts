/** Shared files: the consultant's documents for a client and, where allowed, the client's own uploads. */
import { z } from 'zod';
import { IdSchema } from './common';

export const SHARED_FILE_CATEGORIES = ['soil-test', 'map', 'season-report', 'proposal', 'invoice', 'photo', 'other', 'client-upload'] as const;
export type SharedFileCategory = (typeof SHARED_FILE_CATEGORIES)[number];
/** What staff may choose when they upload ("client-upload" is set by the server for the client's own files). */
export const STAFF_FILE_CATEGORIES = SHARED_FILE_CATEGORIES.filter((c) => c !== 'client-upload');

export const FILE_CATEGORY_LABELS: Record<SharedFileCategory, string> = {
  'soil-test': 'Soil test',
  map: 'Map',
  'season-report': 'Season report',
  proposal: 'Proposal',
  invoice: 'Invoice',
  photo: 'Photo',
  other: 'Other',
  'client-upload': 'Your upload',
};

export const FILE_LIMITS = {
  /** Largest file a person may upload. */
  maxBytes: 15 * 1024 * 1024,
  titleMax: 160,
} as const;

const flag = z.union([z.boolean(), z.enum(['true', 'false', 'on', '1', '0'])]).transform((v) => v === true || v === 'true' || v === 'on' || v === '1');

export const FileListQuerySchema = z.object({
  clientId: IdSchema.optional(),
  propertyId: IdSchema.optional(),
});
export type FileListQuery = z.infer<typeof FileListQuerySchema>;

/** The text fields of a staff upload (multipart: numbers and flags arrive as strings). */
export const StaffFileUploadSchema = z.object({
  clientId: IdSchema,
  propertyId: z.union([z.literal(''), IdSchema]).optional().transform((v) => (v === '' || v === undefined ? null : v)),
  category: z.enum(STAFF_FILE_CATEGORIES as [Exclude<SharedFileCategory, 'client-upload'>, ...Exclude<SharedFileCategory, 'client-upload'>[]], { message: `choose one of ${STAFF_FILE_CATEGORIES.join(', ')}` }),
  title: z.string().trim().max(FILE_LIMITS.titleMax, { message: `must be at most ${FILE_LIMITS.titleMax} characters` }).optional(),
  visibleToClient: flag.optional().default(true),
});
export type StaffFileUploadInput = z.output<typeof StaffFileUploadSchema>;

/** The text fields of a client's own upload. */
export const ClientFileUploadSchema = z.object({
  propertyId: z.union([z.literal(''), IdSchema]).optional().transform((v) => (v === '' || v === undefined ? null : v)),
  title: z.string().trim().max(FILE_LIMITS.titleMax, { message: `must be at most ${FILE_LIMITS.titleMax} characters` }).optional(),
});
export type ClientFileUploadInput = z.output<typeof ClientFileUploadSchema>;

export const FileUpdateSchema = z
  .object({
    title: z.string().trim().min(1, { message: 'enter a title' }).max(FILE_LIMITS.titleMax, { message: `must be at most ${FILE_LIMITS.titleMax} characters` }).optional(),
    visibleToClient: z.boolean().optional(),
  })
  .strict()
  .refine((b) => Object.keys(b).length > 0, { message: 'send title or visibleToClient' });
export type FileUpdateInput = z.infer<typeof FileUpdateSchema>;

export const SharedFileSchema = z.object({
  id: z.number().int(),
  clientId: z.number().int(),
  propertyId: z.number().int().nullable(),
  propertyName: z.string().nullable(),
  category: z.enum(SHARED_FILE_CATEGORIES),
  title: z.string(),
  contentType: z.string(),
  byteSize: z.number().int(),
  visibleToClient: z.boolean(),
  uploadedByRole: z.enum(['staff', 'client']),
  uploadedByName: z.string().nullable(),
  url: z.string(),
  createdAt: z.string(),
});
export type SharedFileDto = z.infer<typeof SharedFileSchema>;

/** File name endings the upload forms offer (the server still decides by content). */
export const UPLOAD_ACCEPT = '.pdf,.png,.jpg,.jpeg,.webp,.csv,.txt,application/pdf,image/png,image/jpeg,image/webp,text/csv,text/plain';

/** What is wrong with a chosen file before it is sent (size and name only), or null. */
export function chosenFileProblem(file: { name: string; size: number } | null | undefined): string | null {
  if (!file) return 'choose a file';
  if (file.size === 0) return 'the file is empty';
  if (file.size > FILE_LIMITS.maxBytes) return `the file is ${(file.size / 1048576).toFixed(1)} MB; files can be at most ${FILE_LIMITS.maxBytes / 1048576} MB`;
  if (!/\.(pdf|png|jpe?g|webp|csv|txt)$/i.test(file.name)) return 'choose a PDF, PNG, JPEG, WebP, CSV or .txt file';
  return null;
}

/** The client's upload form: the shared text fields plus the chosen file. */
export const ClientFileUploadFormSchema = ClientFileUploadSchema.extend({
  file: z.custom<File | null>((v) => chosenFileProblem(v as File | null) === null, { message: 'choose a PDF, PNG, JPEG, WebP, CSV or .txt file of at most 15 MB' }),
});

/** The consultant's upload form: the shared fields plus the chosen file. */
export const StaffFileUploadFormSchema = StaffFileUploadSchema.extend({
  file: z.custom<File | null>((v) => chosenFileProblem(v as File | null) === null, { message: 'choose a PDF, PNG, JPEG, WebP, CSV or .txt file of at most 15 MB' }),
});
