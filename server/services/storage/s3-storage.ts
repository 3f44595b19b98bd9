/**
 * Files in S3-compatible object storage (STORAGE=s3), so every app instance reads what any other
 * one wrote. Uploads go through @aws-sdk/lib-storage (multipart when large).
 */
import { Readable } from 'node:stream';
import { DeleteObjectCommand, GetObjectCommand, ListObjectsV2Command, S3Client, S3ServiceException } from '@aws-sdk/client-s3';
import { Upload } from '@aws-sdk/lib-storage';
import { StoredFileMissing, type Storage } from './storage-types';

export interface S3StorageOptions {
  bucket: string;
  region: string;
  /** An S3-compatible endpoint (empty for AWS itself). */
  endpoint?: string;
  accessKeyId?: string;
  secretAccessKey?: string;
  /** Path-style addresses (bucket in the path), which most S3-compatible services need. */
  forcePathStyle?: boolean;
  /** A folder inside the bucket for every key (e.g. "browseline/"). */
  prefix?: string;
}

const isMissing = (err: unknown): boolean =>
  err instanceof S3ServiceException && (err.name === 'NoSuchKey' || err.name === 'NotFound' || err.$metadata?.httpStatusCode === 404);

/** Storage in one bucket of an S3-compatible service. */
export function createS3Storage(options: S3StorageOptions): Storage {
  const client = new S3Client({
    region: options.region,
    endpoint: options.endpoint || undefined,
    forcePathStyle: options.forcePathStyle ?? Boolean(options.endpoint),
    credentials: options.accessKeyId && options.secretAccessKey ? { accessKeyId: options.accessKeyId, secretAccessKey: options.secretAccessKey } : undefined,
    maxAttempts: 3,
  });
  const prefix = options.prefix ?? '';
  const Bucket = options.bucket;
  return {
    kind: 's3',
    async put(key, bytes, contentType) {
      await new Upload({ client, params: { Bucket, Key: prefix + key, Body: bytes, ContentType: contentType } }).done();
    },
    async get(key) {
      const { stream } = await this.open(key);
      const chunks: Buffer[] = [];
      for await (const chunk of stream) chunks.push(Buffer.isBuffer(chunk) ? chunk : Buffer.from(chunk as Uint8Array));
      return Buffer.concat(chunks);
    },
    async open(key) {
      try {
        const answer = await client.send(new GetObjectCommand({ Bucket, Key: prefix + key }));
        if (!answer.Body) throw new StoredFileMissing(key);
        return { stream: answer.Body as Readable, byteSize: answer.ContentLength ?? 0 };
      } catch (err) {
        if (isMissing(err)) throw new StoredFileMissing(key);
        throw err;
      }
    },
    async remove(key) {
      await client.send(new DeleteObjectCommand({ Bucket, Key: prefix + key }));
    },
    async *list(listPrefix) {
      let ContinuationToken: string | undefined;
      do {
        const page = await client.send(new ListObjectsV2Command({ Bucket, Prefix: prefix + listPrefix, ContinuationToken }));
        for (const o of page.Contents ?? []) {
          if (!o.Key) continue;
          yield { key: o.Key.slice(prefix.length), byteSize: o.Size ?? 0, lastModified: o.LastModified ?? new Date(0) };
        }
        ContinuationToken = page.IsTruncated ? page.NextContinuationToken : undefined;
      } while (ContinuationToken);
    },
  };
}
