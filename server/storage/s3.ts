import "server-only";
import {
  DeleteObjectCommand,
  GetObjectCommand,
  NoSuchKey,
  PutObjectCommand,
  S3Client,
  S3ServiceException,
} from "@aws-sdk/client-s3";
import { Readable } from "node:stream";
import { env, type Env } from "@/server/env";

// Object storage from configuration only, so the local fake (scripts/s3-fake.ts) and a hosted
// bucket are the same code path: only the endpoint, credentials and path style differ.
export type S3Config = {
  /** Unset: the SDK's own endpoint for the region (AWS). */
  endpoint?: string;
  region: string;
  bucket: string;
  accessKeyId?: string;
  secretAccessKey?: string;
  forcePathStyle: boolean;
};

export function s3Config(config: Env = env()): S3Config {
  return {
    endpoint: config.KEELSON_S3_ENDPOINT,
    region: config.KEELSON_S3_REGION,
    bucket: config.KEELSON_S3_BUCKET,
    accessKeyId: config.KEELSON_S3_ACCESS_KEY_ID,
    secretAccessKey: config.KEELSON_S3_SECRET_ACCESS_KEY,
    // Path style (http://host/bucket/key) for the fake and most S3-compatible stores; AWS wants
    // virtual hosts, so the default follows whether an endpoint of one's own is set.
    forcePathStyle: config.KEELSON_S3_FORCE_PATH_STYLE ?? config.KEELSON_S3_ENDPOINT !== undefined,
  };
}

const globalForS3 = globalThis as unknown as { keelsonS3?: S3Client };

/** One S3 client per process. */
export function s3Client(): S3Client {
  if (!globalForS3.keelsonS3) {
    const config = s3Config();
    globalForS3.keelsonS3 = new S3Client({
      endpoint: config.endpoint,
      region: config.region,
      forcePathStyle: config.forcePathStyle,
      // Without keys the SDK's default chain applies (instance role, environment, profile).
      ...(config.accessKeyId && config.secretAccessKey
        ? { credentials: { accessKeyId: config.accessKeyId, secretAccessKey: config.secretAccessKey } }
        : {}),
      // Checksums only where S3 requires them: the newer default (aws-chunked trailing checksums)
      // is not understood by the fake or by several S3-compatible stores.
      requestChecksumCalculation: "WHEN_REQUIRED",
      responseChecksumValidation: "WHEN_REQUIRED",
    });
  }
  return globalForS3.keelsonS3;
}

export function bucketName(): string {
  return s3Config().bucket;
}

/** Stores bytes under a key; the content type is the one the server established, not the browser's. */
export async function putObject(key: string, bytes: Uint8Array, contentType: string): Promise<void> {
  await s3Client().send(
    new PutObjectCommand({
      Bucket: bucketName(),
      Key: key,
      Body: bytes,
      ContentType: contentType,
      ContentLength: bytes.byteLength,
    }),
  );
}

/** The object as a web stream (for a Response body), or null when the bucket has no such key. */
export async function getObjectStream(key: string): Promise<ReadableStream<Uint8Array> | null> {
  try {
    const result = await s3Client().send(new GetObjectCommand({ Bucket: bucketName(), Key: key }));
    const body = result.Body;
    if (!body) return null;
    if (body instanceof Readable) return Readable.toWeb(body) as ReadableStream<Uint8Array>;
    return body.transformToWebStream();
  } catch (error) {
    if (error instanceof NoSuchKey) return null;
    if (error instanceof S3ServiceException && error.$metadata.httpStatusCode === 404) return null;
    throw error;
  }
}

/** Removes an object; removing one that is not there is not an error (S3 answers 204 either way). */
export async function deleteObject(key: string): Promise<void> {
  await s3Client().send(new DeleteObjectCommand({ Bucket: bucketName(), Key: key }));
}
