/** Signed events from the payments service. The body arrives raw (see app.ts) so the signature can be checked. */
import { defineRoutes } from '../middlewares/access';
import { badRequest } from '../errors';
import { verifyWebhook } from '../services/payments/payments-client';
import { processPaymentEvent } from '../commands/payment-recorder';
import { PaymentEventSchema } from '../../shared/schemas/payment-event';
import { logger } from '../logger';

const r = defineRoutes('/webhooks');

r.post('/payments', 'public', async (req, res) => {
  const signature = req.get('stripe-signature');
  if (!signature) throw badRequest('The Stripe-Signature header is missing; only the payments service may call this address.');
  if (!Buffer.isBuffer(req.body)) throw badRequest('Send the event as application/json.');
  let event;
  try {
    event = verifyWebhook(req.body, signature);
  } catch {
    throw badRequest('The webhook signature does not match or is too old. Check PAYMENTS_WEBHOOK_SECRET; nothing was changed.');
  }
  // Signed but not the shape we act on: a 400 (logged) ends the service's retries; a 500 would not.
  const shape = PaymentEventSchema.safeParse(event);
  if (!shape.success) {
    const problems = shape.error.issues.slice(0, 5).map((i) => `${i.path.join('.')}: ${i.message}`);
    logger.warn({ eventId: (event as { id?: unknown }).id, type: (event as { type?: unknown }).type, problems }, 'malformed payment event refused');
    throw badRequest(`The event is signed but malformed (${problems.join('; ')}); nothing was changed.`);
  }
  const result = await processPaymentEvent(event);
  res.json({ received: true, duplicate: result.duplicate });
});

export const webhooksRouter = r.router;
