// Starts the local payments fake on 127.0.0.1 (see app.ts for what it serves).
//
//   npx tsx server/scripts/payments-fake/main.ts
//
// Environment:
//   PAYMENTS_FAKE_PORT          port to listen on (default 12111)
//   PAYMENTS_WEBHOOK_URL        where signed events go (default http://127.0.0.1:3000/api/webhooks/payments;
//                               "off" records events without sending them)
//   PAYMENTS_WEBHOOK_SECRET     endpoint secret the app verifies with (default whsec_browseline_local)
//   PAYMENTS_FAKE_PUBLIC_URL    origin the browser uses for the payment page (default http://127.0.0.1:<port>)

import type { AddressInfo } from 'node:net';
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { PaymentsFakeConfigError, createPaymentsFake, jsonLineLogger } from './app';

const DEFAULT_PORT = 12111;
const DEFAULT_WEBHOOK_URL = 'http://127.0.0.1:3000/api/webhooks/payments';
const DEFAULT_WEBHOOK_SECRET = 'whsec_browseline_local';

/** Reads and checks the fake's settings from the environment. */
export function readPaymentsFakeEnv(env: NodeJS.ProcessEnv): {
  port: number;
  webhookUrl: string | null;
  webhookSecret: string;
  publicUrl: string;
} {
  const rawPort = env.PAYMENTS_FAKE_PORT?.trim() || String(DEFAULT_PORT);
  const port = Number(rawPort);
  if (!/^\d+$/.test(rawPort) || port < 1 || port > 65535) {
    throw new PaymentsFakeConfigError(`PAYMENTS_FAKE_PORT must be a whole number from 1 to 65535, not "${rawPort}".`);
  }
  const rawWebhookUrl = env.PAYMENTS_WEBHOOK_URL?.trim() || DEFAULT_WEBHOOK_URL;
  return {
    port,
    webhookUrl: rawWebhookUrl.toLowerCase() === 'off' ? null : rawWebhookUrl,
    webhookSecret: env.PAYMENTS_WEBHOOK_SECRET?.trim() || DEFAULT_WEBHOOK_SECRET,
    publicUrl: env.PAYMENTS_FAKE_PUBLIC_URL?.trim() || `http://127.0.0.1:${port}`,
  };
}

function main(): void {
  let settings: ReturnType<typeof readPaymentsFakeEnv>;
  let fake: ReturnType<typeof createPaymentsFake>;
  try {
    settings = readPaymentsFakeEnv(process.env);
    fake = createPaymentsFake({
      webhookUrl: settings.webhookUrl,
      webhookSecret: settings.webhookSecret,
      publicUrl: settings.publicUrl,
    });
  } catch (error) {
    if (error instanceof PaymentsFakeConfigError) {
      process.stderr.write(`payments fake: ${error.message}\n`);
      process.exit(2);
    }
    throw error;
  }

  const server = fake.app.listen(settings.port, '127.0.0.1');
  server.on('listening', () => {
    const { address, port } = server.address() as AddressInfo;
    jsonLineLogger({
      msg: 'listening',
      url: `http://${address}:${port}`,
      publicUrl: settings.publicUrl,
      webhookUrl: settings.webhookUrl,
    });
  });
  server.on('error', (error: NodeJS.ErrnoException) => {
    const hint = error.code === 'EADDRINUSE' ? ` Port ${settings.port} is taken: set PAYMENTS_FAKE_PORT to a free port.` : '';
    process.stderr.write(`payments fake: cannot listen on 127.0.0.1:${settings.port}: ${error.message}.${hint}\n`);
    process.exit(1);
  });

  const stop = (signal: string) => {
    jsonLineLogger({ msg: 'stopping', signal });
    fake.state.close();
    server.close(() => process.exit(0));
    server.closeAllConnections();
  };
  process.once('SIGINT', () => stop('SIGINT'));
  process.once('SIGTERM', () => stop('SIGTERM'));
}

// Run only when started as a script, so tests can import readPaymentsFakeEnv.
if (process.argv[1] && import.meta.url === pathToFileURL(resolve(process.argv[1])).href) main();
