/**
 * Integration tests: a fresh database on the test cluster (named for this run, dropped at the end), migrated once; a local SMTP capture
 * server on free ports. The settings reach the test workers through the environment.
 */
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { dropDatabase, freshDatabase, startTestCluster } from './test-db';
import { startSmtpCapture, type SmtpCapture } from '../../server/scripts/smtp-capture';

let capture: SmtpCapture | null = null;

export default async function setup() {
  startTestCluster();
  const url = await freshDatabase('browseline_test');
  process.env.DATABASE_URL = url;
  const root = path.resolve(import.meta.dirname, '../..');
  execFileSync(path.join(root, 'node_modules/.bin/tsx'), [path.join(root, 'server/scripts/migrate.ts')], { env: { ...process.env, DATABASE_URL: url }, stdio: ['ignore', 'ignore', 'inherit'] });
  capture = await startSmtpCapture({ smtpPort: 0, httpPort: 0, quiet: true });
  process.env.SMTP_PORT = String(capture.smtpPort);
  process.env.MAIL_CAPTURE_URL = `http://127.0.0.1:${capture.httpPort}`;
  process.env.PUBLIC_URL = 'http://127.0.0.1:3999';
  process.env.NODE_ENV = 'test';
  return async () => {
    await capture?.close();
    await dropDatabase(url);
  };
}
