/** Sign-up of a new firm and its owner; public, rate-limited, never telling whether an e-mail is registered. */
import { rateLimit, ipKeyGenerator } from 'express-rate-limit';
import { defineRoutes } from '../middlewares/access';
import { typed } from '../middlewares/typed-route';
import { PostgresRateLimitStore } from '../middlewares/rate-limit-store';
import { SignupSchema } from '../../shared/schemas/auth';
import { tooManyRequests } from '../errors';
import { config } from '../config';
import { signUpFirm } from '../commands/firm-signup';
import { performance } from 'node:perf_hooks';

const r = defineRoutes('/signup');

const signupLimiter = rateLimit({
  windowMs: config.signupRateLimit.windowMs,
  limit: config.signupRateLimit.max,
  standardHeaders: 'draft-8',
  legacyHeaders: false,
  store: new PostgresRateLimitStore('signup:'),
  keyGenerator: (req) => ipKeyGenerator(req.ip ?? ''),
  handler: (_req, _res, next) => next(tooManyRequests('Too many sign-ups from this address. Wait an hour and try again, or write to us if you need several firms.')),
});

/** The same answer whether the address is new or already has an account. */
export const SIGNUP_ANSWER = 'Check your e-mail: we sent a link to confirm the address. Open it, then sign in with the password you chose.';

/** Waits until `floorMs` have passed since `startedAt`, so every answer takes the same time. */
async function evenOut(startedAt: number, floorMs: number): Promise<void> {
  const left = startedAt + floorMs - performance.now();
  if (left > 0) await new Promise((resolve) => setTimeout(resolve, left));
}

r.post('/', 'public', signupLimiter, ...typed({ body: SignupSchema }, async ({ body }, req, res) => {
  const startedAt = performance.now();
  await signUpFirm(body, req.ip ?? null);
  // A new address makes a firm and its library; a used one only queues a note. The floor hides the difference.
  await evenOut(startedAt, config.signupAnswerFloorMs);
  res.status(202).json({ data: { message: SIGNUP_ANSWER } });
}));

export const signupRouter = r.router;
