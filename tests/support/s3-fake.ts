/**
 * A local S3-compatible service for tests (s3rver, in-process on 127.0.0.1, a free port, its own
 * temporary folder). A fake of a hosted service; our own storage code runs for real against it.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import S3rver from 's3rver';

export interface S3Fake {
  endpoint: string;
  bucket: string;
  /** The environment an app process needs to use this fake (STORAGE=s3 and the S3_ settings). */
  env: Record<string, string>;
  close(): Promise<void>;
}

/** Starts the fake with one empty bucket. */
export async function startS3Fake(bucket = 'browseline-test', port = 0): Promise<S3Fake> {
  const directory = fs.mkdtempSync(path.join(os.tmpdir(), 'browseline-s3-'));
  const server = new S3rver({ address: '127.0.0.1', port, silent: true, directory, configureBuckets: [{ name: bucket }], vhostBuckets: false });
  const address = await server.run();
  const endpoint = `http://127.0.0.1:${address.port}`;
  return {
    endpoint,
    bucket,
    env: { STORAGE: 's3', S3_ENDPOINT: endpoint, S3_BUCKET: bucket, S3_REGION: 'us-east-1', S3_ACCESS_KEY_ID: 'S3RVER', S3_SECRET_ACCESS_KEY: 'S3RVER', S3_FORCE_PATH_STYLE: 'true' },
    async close() {
      await server.close();
      fs.rmSync(directory, { recursive: true, force: true });
    },
  };
}
