// Shared by the drills: the crew of a stack, objects in its bucket, a slowly streamed upload.
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import { journeyLog, type Crew } from '../support/journey';
import type { Stack } from './stack';

export async function crewOf(stack: Stack): Promise<Crew> {
  const [engineer, technician, qa] = await Promise.all([
    stack.signedIn('engineer@example.com'),
    stack.signedIn('technician@example.com'),
    stack.signedIn('qa@example.com'),
  ]);
  return { engineer, technician, qa };
}

/** How many objects the stack's bucket holds under `prefix`. */
export async function objectCount(stack: Stack, prefix: string): Promise<number> {
  const s3 = new S3Client({
    endpoint: stack.env.S3_ENDPOINT,
    region: 'us-east-1',
    forcePathStyle: true,
    credentials: { accessKeyId: stack.env.S3_ACCESS_KEY_ID!, secretAccessKey: stack.env.S3_SECRET_ACCESS_KEY! },
  });
  try {
    const out = await s3.send(new ListObjectsV2Command({ Bucket: stack.env.S3_BUCKET, Prefix: prefix }));
    return out.KeyCount ?? 0;
  } finally {
    s3.destroy();
  }
}

/**
 * An upload whose bytes the drill lets through: the first part at once, the rest when `finish()`
 * is called. Resolves `response` with the status and body when the server answers.
 */
export function slowUpload(stack: Stack, client: { cookieHeader(): string }, testId: number, csv: string) {
  const bytes = new TextEncoder().encode(csv);
  const firstPart = bytes.subarray(0, 70 * 1024);
  let release!: () => void;
  const gate = new Promise<void>((r) => (release = r));
  const body = new ReadableStream<Uint8Array>({
    async start(controller) {
      controller.enqueue(firstPart);
      await gate;
      controller.enqueue(bytes.subarray(firstPart.length));
      controller.close();
    },
  });
  const response = fetch(`${stack.baseUrl}/api/tests/${testId}/logs`, {
    method: 'POST',
    body,
    duplex: 'half',
    headers: {
      'content-type': 'text/csv',
      'x-filename': 'slow.csv',
      cookie: client.cookieHeader(),
      origin: stack.baseUrl,
    },
  } as RequestInit).then(async (r) => ({ status: r.status, body: (await r.json()) as { error?: { code: string } } }));
  return { response, finish: () => release() };
}

/** A log big enough to stream for a moment (about 200 kilobytes). */
export function bigJourneyLog(): string {
  return journeyLog(0, { rateHz: 20 });
}
