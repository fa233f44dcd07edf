// Object storage through the AWS S3 SDK (a local s3rver in development and tests). The bucket is
// created on first use if it does not exist.
import { Readable } from 'node:stream';
import {
  CreateBucketCommand,
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
} from '@aws-sdk/client-s3';
import { Inject, Injectable, Logger, OnApplicationShutdown } from '@nestjs/common';
import { DomainError } from '../common/errors/domain-error.js';
import { APP_CONFIG, AppConfig } from '../config/config.js';

@Injectable()
export class ObjectStore implements OnApplicationShutdown {
  private readonly logger = new Logger('ObjectStore');
  private readonly client: S3Client | null;
  private bucketReady: Promise<void> | null = null;

  constructor(@Inject(APP_CONFIG) private readonly config: AppConfig) {
    this.client = config.s3Endpoint
      ? new S3Client({
          endpoint: config.s3Endpoint,
          region: config.s3Region,
          forcePathStyle: true,
          credentials: {
            accessKeyId: config.s3AccessKeyId,
            secretAccessKey: config.s3SecretAccessKey,
          },
          maxAttempts: 2,
        })
      : null;
  }

  get configured(): boolean {
    return this.client !== null;
  }

  private s3(): S3Client {
    if (!this.client) {
      throw new DomainError('unavailable', 'Object storage is not configured (S3_ENDPOINT).');
    }
    return this.client;
  }

  private ensureBucket(): Promise<void> {
    const s3 = this.s3();
    const Bucket = this.config.s3Bucket;
    this.bucketReady ??= s3
      .send(new HeadBucketCommand({ Bucket }))
      .then(() => undefined)
      .catch(async () => {
        await s3.send(new CreateBucketCommand({ Bucket }));
      })
      .catch((e: unknown) => {
        this.bucketReady = null;
        throw e;
      });
    return this.bucketReady;
  }

  async put(key: string, body: Buffer, contentType: string): Promise<void> {
    await this.ensureBucket();
    await this.s3().send(
      new PutObjectCommand({
        Bucket: this.config.s3Bucket,
        Key: key,
        Body: body,
        ContentType: contentType,
        ContentLength: body.length,
      }),
    );
  }

  async get(key: string): Promise<{ body: Readable; contentType: string; length?: number }> {
    const out = await this.s3().send(
      new GetObjectCommand({ Bucket: this.config.s3Bucket, Key: key }),
    );
    return {
      body: out.Body as Readable,
      contentType: out.ContentType ?? 'application/octet-stream',
      length: out.ContentLength,
    };
  }

  /** Keys under `prefix` last modified before `before`, a page (≤ 1,000) at a time. */
  async *listOlderThan(prefix: string, before: Date): AsyncGenerator<string[]> {
    await this.ensureBucket();
    let token: string | undefined;
    do {
      const page = await this.s3().send(
        new ListObjectsV2Command({
          Bucket: this.config.s3Bucket,
          Prefix: prefix,
          ContinuationToken: token,
        }),
      );
      const keys = (page.Contents ?? [])
        .filter((o) => o.Key && o.LastModified && o.LastModified < before)
        .map((o) => o.Key!);
      if (keys.length) yield keys;
      token = page.IsTruncated ? page.NextContinuationToken : undefined;
    } while (token);
  }

  /** Best effort: a failure is logged, never thrown (used to undo a half-finished upload). */
  async deleteQuietly(key: string): Promise<boolean> {
    try {
      await this.s3().send(new DeleteObjectCommand({ Bucket: this.config.s3Bucket, Key: key }));
      return true;
    } catch (e) {
      this.logger.warn(`could not delete ${key}: ${(e as Error).message}`);
      return false;
    }
  }

  onApplicationShutdown(): void {
    this.client?.destroy();
  }
}
