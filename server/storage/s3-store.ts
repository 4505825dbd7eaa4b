import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  NoSuchKey,
  NotFound,
  PutObjectCommand,
  S3Client,
} from '@aws-sdk/client-s3';
import { Readable } from 'node:stream';
import { storageWriteError } from './storage-errors';
import { assertValidKey, type FileStore } from './file-store';

export interface S3StoreOptions {
  /** e.g. https://objects.example.net; omitted for the provider's default endpoint. */
  endpoint?: string;
  region: string;
  bucket: string;
  accessKeyId: string;
  secretAccessKey: string;
  /** Path-style URLs (bucket in the path), which most S3-compatible services and local fakes expect. */
  forcePathStyle: boolean;
  /** Optional prefix inside the bucket, e.g. "benchwire/". */
  prefix?: string;
}

function isMissing(error: unknown) {
  if (error instanceof NoSuchKey || error instanceof NotFound) return true;
  const status = (error as { $metadata?: { httpStatusCode?: number } })?.$metadata?.httpStatusCode;
  return status === 404;
}

/** S3-compatible object storage through the AWS SDK v3 client. */
export class S3Store implements FileStore {
  readonly driver = 's3' as const;
  private readonly client: S3Client;

  constructor(private readonly options: S3StoreOptions) {
    this.client = new S3Client({
      endpoint: options.endpoint,
      region: options.region,
      forcePathStyle: options.forcePathStyle,
      credentials: { accessKeyId: options.accessKeyId, secretAccessKey: options.secretAccessKey },
    });
  }

  private objectKey(key: string) {
    assertValidKey(key);
    return `${this.options.prefix ?? ''}${key}`;
  }

  async put(key: string, body: Buffer, contentType: string) {
    const objectKey = this.objectKey(key);
    try {
      await this.client.send(
        new PutObjectCommand({
          Bucket: this.options.bucket,
          Key: objectKey,
          Body: body,
          ContentType: contentType,
          ContentLength: body.length,
        }),
      );
    } catch (error) {
      throw storageWriteError(error, 's3');
    }
  }

  async get(key: string) {
    const stream = await this.open(key);
    if (!stream) return null;
    const chunks: Buffer[] = [];
    for await (const chunk of stream) chunks.push(Buffer.from(chunk as Uint8Array));
    return Buffer.concat(chunks);
  }

  async open(key: string) {
    try {
      const result = await this.client.send(
        new GetObjectCommand({ Bucket: this.options.bucket, Key: this.objectKey(key) }),
      );
      if (!result.Body) return null;
      return result.Body instanceof Readable
        ? result.Body
        : Readable.from(result.Body as unknown as AsyncIterable<Uint8Array>);
    } catch (error) {
      if (isMissing(error)) return null;
      throw error;
    }
  }

  async exists(key: string) {
    try {
      await this.client.send(new HeadObjectCommand({ Bucket: this.options.bucket, Key: this.objectKey(key) }));
      return true;
    } catch (error) {
      if (isMissing(error)) return false;
      throw error;
    }
  }

  async delete(key: string) {
    await this.client.send(new DeleteObjectCommand({ Bucket: this.options.bucket, Key: this.objectKey(key) }));
  }

  destroy() {
    this.client.destroy();
  }
}
