import {
  CreateBucketCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  ListObjectsV2Command,
  NoSuchKey,
  PutObjectCommand,
  S3Client,
} from '@aws-sdk/client-s3';
import { serviceUnavailable } from '../errors';
import { newStorageKey, STORAGE_KEY_PREFIX, type RawStorage } from './raw-storage';

/** Settings of an S3-compatible object store, read from `S3_*` variables. */
export interface S3Settings {
  endpoint?: string;
  region: string;
  bucket: string;
  accessKeyId: string;
  secretAccessKey: string;
  forcePathStyle: boolean;
}

/** Reads S3 settings from the environment; throws naming the first missing variable. */
export function s3SettingsFromEnv(
  env: Record<string, string | undefined> = process.env,
): S3Settings {
  const need = (key: string): string => {
    const value = env[key];
    if (!value) throw new Error(`RAW_STORAGE=s3 needs ${key}`);
    return value;
  };
  return {
    endpoint: env.S3_ENDPOINT || undefined,
    region: env.S3_REGION ?? 'us-east-1',
    bucket: need('S3_BUCKET'),
    accessKeyId: need('S3_ACCESS_KEY_ID'),
    secretAccessKey: need('S3_SECRET_ACCESS_KEY'),
    forcePathStyle: env.S3_FORCE_PATH_STYLE !== 'false',
  };
}

/**
 * Raw files as objects in an S3-compatible bucket, under generated keys. Objects are written
 * before the database transaction commits; when it rolls back, the caller removes the object
 * with `delete`. Checksums are only computed when required, since the default streaming
 * checksums are not understood by every S3-compatible server.
 */
export class S3RawStorage implements RawStorage {
  readonly kind = 's3' as const;
  readonly writesInTransaction = false;
  private readonly client: S3Client;
  private bucketChecked = false;

  constructor(private readonly settings: S3Settings) {
    this.client = new S3Client({
      endpoint: settings.endpoint,
      region: settings.region,
      forcePathStyle: settings.forcePathStyle,
      credentials: { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey },
      requestChecksumCalculation: 'WHEN_REQUIRED',
      responseChecksumValidation: 'WHEN_REQUIRED',
    });
  }

  /** Creates the bucket when it does not exist yet (first use only). */
  private async ensureBucket(): Promise<void> {
    if (this.bucketChecked) return;
    try {
      await this.client.send(new HeadBucketCommand({ Bucket: this.settings.bucket }));
    } catch {
      await this.client.send(new CreateBucketCommand({ Bucket: this.settings.bucket }));
    }
    this.bucketChecked = true;
  }

  /**
   * Writes `content` under a new key. An unreachable or failing store is a 503 (the upload
   * stores nothing and may be sent again), not a server fault.
   */
  async put(content: Buffer): Promise<string> {
    const key = newStorageKey();
    try {
      await this.ensureBucket();
      await this.client.send(
        new PutObjectCommand({
          Bucket: this.settings.bucket,
          Key: key,
          Body: content,
          ContentLength: content.length,
          ContentType: 'application/octet-stream',
        }),
      );
    } catch (error) {
      throw serviceUnavailable(
        `The raw-file store does not answer right now (${(error as Error).name || 'error'}); ` +
          'nothing was stored. Retry in a few seconds',
      );
    }
    return key;
  }

  async get(key: string): Promise<Buffer | null> {
    try {
      const res = await this.client.send(
        new GetObjectCommand({ Bucket: this.settings.bucket, Key: key }),
      );
      if (!res.Body) return null;
      return Buffer.from(await res.Body.transformToByteArray());
    } catch (error) {
      if (error instanceof NoSuchKey || (error as { name?: string }).name === 'NoSuchKey')
        return null;
      throw error;
    }
  }

  /**
   * The keys Rhotrace generates (`raw-…`) of objects last written before `before`, a page (up
   * to 1,000) at a time. Other objects in the bucket are never listed.
   */
  async *keysWrittenBefore(before: Date): AsyncGenerator<string[]> {
    await this.ensureBucket();
    let token: string | undefined;
    do {
      const page = await this.client.send(
        new ListObjectsV2Command({
          Bucket: this.settings.bucket,
          Prefix: STORAGE_KEY_PREFIX,
          ContinuationToken: token,
        }),
      );
      const keys = (page.Contents ?? [])
        .filter((o) => o.Key && o.LastModified && o.LastModified.getTime() < before.getTime())
        .map((o) => o.Key!);
      if (keys.length) yield keys;
      token = page.IsTruncated ? page.NextContinuationToken : undefined;
    } while (token);
  }

  async delete(key: string): Promise<void> {
    await this.client.send(new DeleteObjectCommand({ Bucket: this.settings.bucket, Key: key }));
  }

  close(): void {
    this.client.destroy();
  }
}
