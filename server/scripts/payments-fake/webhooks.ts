// Webhook delivery for the local payments fake: POSTs each event as pretty-printed JSON (as the
// hosted service does, so an app that re-serialises the body before verifying fails here too),
// signed with `Stripe-Signature: t=<unix>,v1=<hex HMAC-SHA256 of "t.payload">` made by the SDK's
// own generateTestHeaderString. A delivery that does not get a 2xx is retried after each delay
// in `retryDelaysMs`, then given up; every attempt is recorded.

import Stripe from 'stripe';
import type { FakeEvent } from './ledger';

/** One POST of one event to the webhook URL. */
export interface DeliveryAttempt {
  eventId: string;
  eventType: string;
  /** 1 for the first try of a delivery, 2 for its first retry, … */
  attempt: number;
  /** True when this delivery was asked for through the control API. */
  redelivery: boolean;
  at: string;
  /** HTTP status from the receiver, or null when the connection failed. */
  status: number | null;
  ok: boolean;
  error: string | null;
  durationMs: number;
}

export interface WebhookDispatcherOptions {
  /** Where events go; null records events without sending them. */
  url: string | null;
  secret: string;
  /** Waits before each retry; the length bounds the retries. Default 0.5 s, 2 s, 8 s. */
  retryDelaysMs?: readonly number[];
  /** Per-attempt timeout. Default 5 s. */
  timeoutMs?: number;
  log?: (line: Record<string, unknown>) => void;
}

export const DEFAULT_RETRY_DELAYS_MS: readonly number[] = [500, 2000, 8000];

/** Sends signed events to one webhook URL, retrying with backoff, and keeps a log of attempts. */
export class WebhookDispatcher {
  readonly attempts: DeliveryAttempt[] = [];
  private readonly retryDelaysMs: readonly number[];
  private readonly timeoutMs: number;
  private readonly inFlight = new Set<Promise<unknown>>();
  private readonly timers = new Map<NodeJS.Timeout, () => void>();
  private generation = 0;

  constructor(private readonly options: WebhookDispatcherOptions) {
    this.retryDelaysMs = options.retryDelaysMs ?? DEFAULT_RETRY_DELAYS_MS;
    this.timeoutMs = options.timeoutMs ?? 5000;
  }

  /**
   * Starts delivering `event` in the background. `first` settles after the first attempt (null
   * when delivery is disabled or cancelled); `done` when the delivery succeeds or gives up.
   */
  dispatch(event: FakeEvent, redelivery = false): { first: Promise<DeliveryAttempt | null>; done: Promise<DeliveryAttempt[]> } {
    let reportFirst: (attempt: DeliveryAttempt | null) => void = () => undefined;
    const first = new Promise<DeliveryAttempt | null>((resolve) => {
      reportFirst = resolve;
    });
    const done = this.deliver(event, redelivery, (attempt) => reportFirst(attempt)).catch((error: unknown) => {
      this.options.log?.({ msg: 'webhook delivery crashed', eventId: event.id, error: String(error) });
      return [];
    });
    void done.finally(() => reportFirst(null));
    this.inFlight.add(done);
    void done.finally(() => this.inFlight.delete(done));
    return { first, done };
  }

  /** Resolves once every delivery started so far has succeeded or given up. */
  async idle(): Promise<void> {
    while (this.inFlight.size > 0) await Promise.allSettled([...this.inFlight]);
  }

  /** Drops pending retries (used by reset and shutdown); attempts already sent stay in the log. */
  cancelPending(): void {
    this.generation += 1;
    for (const [timer, release] of this.timers) {
      clearTimeout(timer);
      release();
    }
    this.timers.clear();
  }

  /** Forgets the attempt log and cancels pending retries. */
  reset(): void {
    this.cancelPending();
    this.attempts.length = 0;
  }

  private async deliver(
    event: FakeEvent,
    redelivery: boolean,
    onAttempt: (attempt: DeliveryAttempt) => void,
  ): Promise<DeliveryAttempt[]> {
    const made: DeliveryAttempt[] = [];
    if (this.options.url === null) return made;
    const generation = this.generation;
    const payload = JSON.stringify(event, null, 2);
    for (let attempt = 1; attempt <= this.retryDelaysMs.length + 1; attempt += 1) {
      if (attempt > 1) {
        const waited = await this.wait(this.retryDelaysMs[attempt - 2]);
        if (!waited || generation !== this.generation) break;
      }
      const result = await this.post(event, payload, attempt, redelivery);
      if (generation !== this.generation) break;
      this.attempts.push(result);
      made.push(result);
      this.options.log?.({ msg: 'webhook', ...result });
      onAttempt(result);
      if (result.ok) break;
    }
    return made;
  }

  private async post(event: FakeEvent, payload: string, attempt: number, redelivery: boolean): Promise<DeliveryAttempt> {
    const started = Date.now();
    const base = { eventId: event.id, eventType: event.type, attempt, redelivery, at: new Date(started).toISOString() };
    try {
      const signature = Stripe.webhooks.generateTestHeaderString({ payload, secret: this.options.secret });
      const response = await fetch(this.options.url as string, {
        method: 'POST',
        headers: {
          'Content-Type': 'application/json; charset=utf-8',
          'Stripe-Signature': signature,
          'User-Agent': 'Stripe/1.0 (+https://stripe.com/docs/webhooks) browseline-payments-fake',
        },
        body: payload,
        redirect: 'manual',
        signal: AbortSignal.timeout(this.timeoutMs),
      });
      await response.arrayBuffer().catch(() => undefined);
      const ok = response.status >= 200 && response.status < 300;
      return {
        ...base,
        status: response.status,
        ok,
        error: ok ? null : `receiver answered HTTP ${response.status}`,
        durationMs: Date.now() - started,
      };
    } catch (error) {
      const cause = (error as { cause?: { code?: string } }).cause?.code;
      const message = error instanceof Error ? error.message : String(error);
      return { ...base, status: null, ok: false, error: cause ? `${message} (${cause})` : message, durationMs: Date.now() - started };
    }
  }

  /** Resolves true after `delayMs`, or false at once if pending retries are cancelled. */
  private wait(delayMs: number): Promise<boolean> {
    return new Promise((resolve) => {
      const timer = setTimeout(() => {
        this.timers.delete(timer);
        resolve(true);
      }, delayMs);
      timer.unref();
      this.timers.set(timer, () => resolve(false));
    });
  }
}
