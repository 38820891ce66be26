// S3-compatible object storage through @aws-sdk/client-s3. A multipart upload either completes into the
// object or is aborted, so a failed upload leaves no object under the key.
import fs from 'node:fs';
import { Readable } from 'node:stream';
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  S3Client,
  CreateBucketCommand,
  HeadBucketCommand,
  ListObjectsV2Command,
} from '@aws-sdk/client-s3';
import { Upload } from '@aws-sdk/lib-storage';
import type { ByteRange, ObjectStore, StoredObject } from './index';

export interface S3Settings {
  endpoint: string;
  bucket: string;
  region: string;
  accessKeyId: string;
  secretAccessKey: string;
}

export class S3Store implements ObjectStore {
  private readonly client: S3Client;
  private bucketReady: Promise<void> | null = null;

  constructor(private readonly s: S3Settings) {
    this.client = new S3Client({
      endpoint: s.endpoint,
      region: s.region,
      forcePathStyle: true,
      credentials: { accessKeyId: s.accessKeyId, secretAccessKey: s.secretAccessKey },
    });
  }

  /** Creates the bucket on first use if it is missing (a local fake starts empty). */
  private ensureBucket() {
    this.bucketReady ??= this.client
      .send(new HeadBucketCommand({ Bucket: this.s.bucket }))
      .then(() => undefined)
      .catch(async () => {
        await this.client.send(new CreateBucketCommand({ Bucket: this.s.bucket }));
      });
    return this.bucketReady;
  }

  async put(key: string, source: Readable, contentType: string): Promise<void> {
    await this.ensureBucket();
    const upload = new Upload({
      client: this.client,
      params: { Bucket: this.s.bucket, Key: key, Body: source, ContentType: contentType },
      leavePartsOnError: false,
    });
    await upload.done();
  }

  /** Object storage has no rename from local disk: the file is sent like any stream. */
  adopt(key: string, file: string, contentType: string): Promise<void> {
    return this.put(key, fs.createReadStream(file), contentType);
  }

  async read(key: string, range?: ByteRange): Promise<Readable> {
    const res = await this.client.send(
      new GetObjectCommand({
        Bucket: this.s.bucket,
        Key: key,
        Range: range ? `bytes=${range.start}-${range.end}` : undefined,
      }),
    );
    return res.Body as Readable;
  }

  async remove(key: string): Promise<void> {
    await this.client.send(new DeleteObjectCommand({ Bucket: this.s.bucket, Key: key }));
  }

  async exists(key: string): Promise<boolean> {
    try {
      await this.client.send(new HeadObjectCommand({ Bucket: this.s.bucket, Key: key }));
      return true;
    } catch {
      return false;
    }
  }

  async *list(): AsyncIterable<StoredObject> {
    await this.ensureBucket();
    let token: string | undefined;
    do {
      const page = await this.client.send(
        new ListObjectsV2Command({ Bucket: this.s.bucket, ContinuationToken: token }),
      );
      for (const o of page.Contents ?? [])
        if (o.Key) yield { key: o.Key, sizeBytes: o.Size ?? 0, modifiedAt: o.LastModified ?? new Date(0) };
      token = page.IsTruncated ? page.NextContinuationToken : undefined;
    } while (token);
  }
}
