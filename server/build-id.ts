/**
 * The build this process runs: BUILD_ID when the deployment sets it (a commit or image tag),
 * else the git commit of the checkout, else the package version. ETags carry it, so a new build's
 * answer format is never met with an old 304.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { projectRoot } from './config';

function fromCheckout(): string | null {
  try {
    return execFileSync('git', ['rev-parse', '--short=12', 'HEAD'], { cwd: projectRoot, stdio: ['ignore', 'pipe', 'ignore'], timeout: 2000 }).toString().trim() || null;
  } catch {
    return null;
  }
}

function packageVersion(): string {
  try {
    return (JSON.parse(fs.readFileSync(path.join(projectRoot, 'package.json'), 'utf8')) as { version?: string }).version ?? '0';
  } catch {
    return '0';
  }
}

/** A short token safe inside an ETag (letters, digits, dot, dash). */
export const buildId: string = (process.env.BUILD_ID || fromCheckout() || `v${packageVersion()}`).replace(/[^A-Za-z0-9.-]/g, '').slice(0, 40) || 'dev';
