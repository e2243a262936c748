/**
 * The S3 driver (any service speaking the S3 API): each object is `<prefix><sha256>` in one bucket.
 * A PUT is atomic on S3, so a reader never sees half an object; a HEAD first skips bytes already there.
 * Checksums are sent and checked only where the API requires them, so that S3-compatible services
 * that do not know the newer checksum headers work too.
 */
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from "@aws-sdk/client-s3";
import { assertDigest, sha256Hex, type BlobStore, type PutResult, type StoredObject } from "./index";

export interface S3Settings {
  bucket: string;
  prefix?: string;
  region?: string;
  endpoint?: string;
  forcePathStyle?: boolean;
  accessKeyId?: string;
  secretAccessKey?: string;
}

const missing = (e: unknown) => e instanceof S3ServiceException && (e.$metadata.httpStatusCode === 404 || e.name === "NotFound" || e.name === "NoSuchKey");

export class S3Store implements BlobStore {
  readonly driver = "s3" as const;
  private readonly client: S3Client;
  private readonly bucket: string;
  private readonly prefix: string;

  constructor(s: S3Settings) {
    this.bucket = s.bucket;
    this.prefix = s.prefix ?? "";
    this.client = new S3Client({
      region: s.region ?? "us-east-1",
      ...(s.endpoint ? { endpoint: s.endpoint } : {}),
      forcePathStyle: s.forcePathStyle ?? !!s.endpoint,
      // Without explicit keys the SDK's own chain applies (AWS_ACCESS_KEY_ID, profiles, instance roles).
      ...(s.accessKeyId && s.secretAccessKey ? { credentials: { accessKeyId: s.accessKeyId, secretAccessKey: s.secretAccessKey } } : {}),
      requestChecksumCalculation: "WHEN_REQUIRED",
      responseChecksumValidation: "WHEN_REQUIRED",
    });
  }

  private key(sha256: string): string {
    assertDigest(sha256);
    return `${this.prefix}${sha256}`;
  }

  async put(bytes: Uint8Array): Promise<PutResult> {
    const sha256 = sha256Hex(bytes);
    if (await this.has(sha256)) return { sha256, size: bytes.byteLength, created: false };
    await this.client.send(
      new PutObjectCommand({
        Bucket: this.bucket,
        Key: this.key(sha256),
        Body: bytes,
        ContentLength: bytes.byteLength,
        ContentType: "application/octet-stream",
      }),
    );
    return { sha256, size: bytes.byteLength, created: true };
  }

  async get(sha256: string): Promise<Uint8Array | null> {
    try {
      const out = await this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key: this.key(sha256) }));
      return out.Body ? await out.Body.transformToByteArray() : new Uint8Array();
    } catch (e) {
      if (missing(e)) return null;
      throw e;
    }
  }

  async has(sha256: string): Promise<boolean> {
    try {
      await this.client.send(new HeadObjectCommand({ Bucket: this.bucket, Key: this.key(sha256) }));
      return true;
    } catch (e) {
      if (missing(e)) return false;
      throw e;
    }
  }

  async delete(sha256: string): Promise<void> {
    await this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: this.key(sha256) }));
  }

  async *list(): AsyncIterable<StoredObject> {
    let token: string | undefined;
    do {
      const page = await this.client.send(new ListObjectsV2Command({ Bucket: this.bucket, Prefix: this.prefix || undefined, ContinuationToken: token }));
      for (const o of page.Contents ?? []) {
        const name = (o.Key ?? "").slice(this.prefix.length);
        if (/^[0-9a-f]{64}$/.test(name)) yield { sha256: name, modified: o.LastModified ?? new Date(0) };
      }
      token = page.IsTruncated ? page.NextContinuationToken : undefined;
    } while (token);
  }

  /** For tests and scripts: close the client's sockets. */
  close(): void {
    this.client.destroy();
  }
}
