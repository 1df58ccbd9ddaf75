// Local S3-compatible object store (s3rver) on loopback, keeping objects under a folder.
// The app reaches it only through @aws-sdk/client-s3, so a real S3 endpoint works by env alone.
import S3rver from 's3rver';
import { mkdirSync } from 'node:fs';

/** Start s3rver on 127.0.0.1:port with `bucket` configured; resolves to { close, endpoint }. */
export async function startS3({ directory, port, bucket }) {
  mkdirSync(directory, { recursive: true });
  const server = new S3rver({
    address: '127.0.0.1',
    port,
    directory,
    silent: true,
    vhostBuckets: false,
    configureBuckets: [{ name: bucket }],
  });
  const { port: actual } = await server.run();
  return { endpoint: `http://127.0.0.1:${actual}`, close: () => server.close() };
}
