/**
 * The shape of the payments service's webhook events that the app acts on. A signed event that does
 * not have this shape is answered 400 and logged (a 500 would make the service retry it for days).
 */
import { z } from 'zod';

const metadata = z.record(z.string(), z.string()).nullish();
const expandable = z.union([z.string().min(1), z.object({ id: z.string().min(1) })]);
const cents = z.number().int().nonnegative().max(99_999_999_99);
const unixSeconds = z.number().int().nonnegative();

const CheckoutSessionSchema = z.object({
  id: z.string().min(1),
  payment_status: z.string(),
  payment_intent: expandable.nullish(),
  amount_total: cents.nullish(),
  currency: z.string().min(3).max(3).nullish(),
  metadata,
});

const PaymentIntentSchema = z.object({
  id: z.string().min(1),
  amount: cents,
  amount_received: cents.nullish(),
  currency: z.string().min(3).max(3),
  created: unixSeconds,
  metadata,
});

const RefundObjectSchema = z.object({
  id: z.string().min(1),
  amount: cents,
  status: z.string().nullish(),
  payment_intent: expandable.nullish(),
  metadata,
});

/** Every event: an id, a type and a data object; the types the app handles have their own shapes. */
export const PaymentEventSchema = z
  .object({
    id: z.string().min(1).max(255),
    type: z.string().min(1).max(255),
    created: unixSeconds,
    data: z.object({ object: z.record(z.string(), z.unknown()) }),
  })
  .superRefine((event, ctx) => {
    const shape =
      event.type === 'checkout.session.completed' ? CheckoutSessionSchema : event.type === 'payment_intent.succeeded' ? PaymentIntentSchema : event.type.startsWith('refund.') ? RefundObjectSchema : null;
    if (!shape) return;
    const parsed = shape.safeParse(event.data.object);
    if (!parsed.success) for (const issue of parsed.error.issues) ctx.addIssue({ code: 'custom', path: ['data', 'object', ...issue.path.map((p) => (typeof p === 'symbol' ? String(p) : p))], message: issue.message });
  });
