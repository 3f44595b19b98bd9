/** JSON logging (pino); quiet in tests unless LOG_LEVEL says otherwise. */
import pino from 'pino';

export const logger = pino({
  level: process.env.LOG_LEVEL ?? (process.env.VITEST ? 'silent' : 'info'),
  base: { service: 'browseline' },
  redact: ['req.headers.cookie', 'req.headers.authorization', 'req.headers["x-csrf-token"]', 'password'],
});
