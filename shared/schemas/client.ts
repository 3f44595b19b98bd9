import { z } from 'zod';
import { LIMITS } from '../limits';
import { optionalText, PageQuerySchema } from './common';

export const ClientCreateSchema = z.object({
  name: z.string().trim().min(1, { message: 'enter the client’s name' }).max(LIMITS.nameMax),
  email: z
    .union([z.literal(''), z.string().trim().toLowerCase().email({ message: 'enter an e-mail address like name@example.com' }).max(LIMITS.emailMax)])
    .transform((v) => (v === '' ? null : v))
    .nullish(),
  phone: optionalText(40),
  address: optionalText(400),
  notes: optionalText(LIMITS.textMax),
});
export type ClientCreateInput = z.infer<typeof ClientCreateSchema>;
export const ClientUpdateSchema = ClientCreateSchema.partial().extend({
  /** Whether the client's contacts may upload their own files in the portal. */
  portalUploadsAllowed: z.boolean().optional(),
  /** Whether the client's contacts may log field observations on their own land in the portal. */
  portalObservationsAllowed: z.boolean().optional(),
});
export type ClientUpdateInput = z.infer<typeof ClientUpdateSchema>;

export const ClientSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  email: z.string().nullable(),
  phone: z.string().nullable(),
  address: z.string().nullable(),
  notes: z.string().nullable(),
  portalUploadsAllowed: z.boolean(),
  portalObservationsAllowed: z.boolean(),
  propertyCount: z.number().int(),
  totalAcres: z.number(),
  createdAt: z.string(),
  updatedAt: z.string(),
});
export type ClientDto = z.infer<typeof ClientSchema>;

export const ClientListQuerySchema = z
  .object({
    q: z.string().trim().max(100).optional(),
  })
  .extend(PageQuerySchema.shape);
