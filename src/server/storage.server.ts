// Object storage for logs and stored series, through @aws-sdk/client-s3 only, so any S3
// endpoint works by env. The checksum settings keep s3rver from storing chunk framing in a
// streamed object and let unknown-length streams upload (STACK.md).
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadBucketCommand,
  PutObjectCommand,
  S3Client,
} from '@aws-sdk/client-s3';
import { Upload } from '@aws-sdk/lib-storage';
import type { Readable } from 'node:stream';
import { getConfig } from '../config.server';

process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= 'true';

let client: S3Client | null = null;

export function getS3(): S3Client {
  if (client) return client;
  const c = getConfig();
  client = new S3Client({
    endpoint: c.S3_ENDPOINT || undefined,
    region: c.S3_REGION,
    forcePathStyle: c.S3_FORCE_PATH_STYLE,
    credentials: { accessKeyId: c.S3_ACCESS_KEY_ID, secretAccessKey: c.S3_SECRET_ACCESS_KEY },
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });
  return client;
}

const bucket = () => getConfig().S3_BUCKET;

/** Stream a body of unknown length to `key` (multipart above 8 MB parts); never buffers it whole. */
export async function putObjectStream(
  key: string,
  body: Readable | ReadableStream | Uint8Array | string,
  contentType = 'application/octet-stream',
): Promise<void> {
  const upload = new Upload({
    client: getS3(),
    params: { Bucket: bucket(), Key: key, Body: body as never, ContentType: contentType },
    partSize: 8 * 1024 * 1024,
    queueSize: 2,
  });
  await upload.done();
}

export async function putObject(
  key: string,
  body: string | Uint8Array,
  contentType = 'application/json',
): Promise<void> {
  await getS3().send(new PutObjectCommand({ Bucket: bucket(), Key: key, Body: body, ContentType: contentType }));
}

/** The object's body as a Node stream (an AsyncIterable of Buffers). */
export async function getObjectStream(key: string): Promise<Readable> {
  const res = await getS3().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
  return res.Body as Readable;
}

export async function getObjectText(key: string): Promise<string> {
  const res = await getS3().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
  return res.Body!.transformToString('utf8');
}

export async function deleteObject(key: string): Promise<void> {
  await getS3().send(new DeleteObjectCommand({ Bucket: bucket(), Key: key }));
}

/** Whether the bucket answers (health check). */
export async function storageAnswers(timeoutMs = 2000): Promise<boolean> {
  try {
    await getS3().send(new HeadBucketCommand({ Bucket: bucket() }), { abortSignal: AbortSignal.timeout(timeoutMs) });
    return true;
  } catch {
    return false;
  }
}

/** The object's bytes. */
export async function getObjectBytes(key: string): Promise<Uint8Array> {
  const res = await getS3().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
  return res.Body!.transformToByteArray();
}

/** The object's bytes, or null when there is no such object. */
export async function getObjectBytesIfExists(key: string): Promise<Uint8Array | null> {
  try {
    const res = await getS3().send(new GetObjectCommand({ Bucket: bucket(), Key: key }));
    return await res.Body!.transformToByteArray();
  } catch (err) {
    const e = err as { name?: string; $metadata?: { httpStatusCode?: number } };
    if (e.name === 'NoSuchKey' || e.$metadata?.httpStatusCode === 404) return null;
    throw err;
  }
}
