/**
 * The payments SDK, pointed by configuration at the local fake (development, tests) or at the
 * real hosted service (PAYMENTS_API_BASE empty). Every create call carries an idempotency key, and
 * a service that cannot be reached becomes a 503 with a sentence a person can act on.
 */
import Stripe from 'stripe';
import { config } from '../../config';
import { serviceUnavailable, AppError } from '../../errors';
import { logger } from '../../logger';

let cached: { key: string; client: Stripe } | null = null;

/** The SDK options for an API base such as http://127.0.0.1:12111 ('' = the hosted service). */
export function sdkOptions(apiBase: string): Stripe.StripeConfig {
  const base: Stripe.StripeConfig = { maxNetworkRetries: 0, telemetry: false, timeout: 15_000 };
  if (!apiBase) return base;
  const url = new URL(apiBase);
  const protocol = url.protocol === 'https:' ? 'https' : 'http';
  return { ...base, host: url.hostname, port: Number(url.port || (protocol === 'https' ? 443 : 80)), protocol };
}

/** The SDK client for the current configuration (made once per API base). */
export function payments(): Stripe {
  const key = `${config.payments.apiBase}|${config.payments.secretKey}`;
  if (!cached || cached.key !== key) cached = { key, client: new Stripe(config.payments.secretKey, sdkOptions(config.payments.apiBase)) };
  return cached.client;
}

/** Verifies a webhook delivery on its raw body; throws when the signature is forged or stale. */
export function verifyWebhook(rawBody: Buffer, signature: string): Stripe.Event {
  return payments().webhooks.constructEvent(rawBody, signature, config.payments.webhookSecret);
}

/**
 * What a failed call may have done. 'nothing': the call cannot move money by itself (a payment page,
 * a read), so "nothing was charged" is true. 'unknown': the call moves money (a refund) and, when the
 * answer is lost, the service may have done it: the message must say so, not that nothing happened.
 */
export type CallEffect = 'nothing' | 'unknown';

/** Runs a payments API call; connection failures and service errors become a 503 with a sentence that is true. */
export async function callPayments<T>(what: string, call: () => Promise<T>, effect: CallEffect = 'nothing'): Promise<T> {
  try {
    return await call();
  } catch (err) {
    if (err instanceof AppError) throw err;
    const e = err as { type?: string; statusCode?: number; message?: string; code?: string };
    logger.warn({ what, type: e.type, statusCode: e.statusCode, code: e.code, msg: e.message }, 'payments call failed');
    if (e.type === 'StripeIdempotencyError') {
      throw new AppError(409, 'payments_request_reused', `This request was sent before with other values, so the payment service refused to ${what}. Reload the page and start again.`);
    }
    if (e.type === 'StripeInvalidRequestError' && e.statusCode && e.statusCode < 500) {
      throw new AppError(409, 'payments_refused', `The payment service refused to ${what}: ${e.message ?? 'no reason given'}.`);
    }
    if (effect === 'unknown') {
      throw new AppError(
        503,
        'payments_outcome_unknown',
        `We did not get an answer from the payment service, so we cannot tell yet whether it managed to ${what}. Do not start a new one: send this same request again (it cannot be done twice), or reload the invoice in a few minutes to see whether it went through.`,
      );
    }
    throw serviceUnavailable(`The payment service is not reachable right now, so we could not ${what}. Nothing was charged; please try again in a few minutes.`);
  }
}
