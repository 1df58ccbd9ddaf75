// Local S3-compatible object store (s3rver) on loopback, keeping objects under a folder.
// The app reaches it only through @aws-sdk/client-s3, so a real S3 endpoint works by env alone.
// s3rver knows one key pair (S3RVER/S3RVER); a caller may register its own as well, so a test
// can run the app outside demo mode, which refuses those default keys.
import S3rver from 's3rver';
import AWSAccount from 's3rver/lib/models/account.js';
import { mkdirSync } from 'node:fs';

/** Start s3rver on 127.0.0.1:port with `bucket` configured; resolves to { close, endpoint }. */
export async function startS3({ directory, port, bucket, accessKeyId, secretAccessKey }) {
  mkdirSync(directory, { recursive: true });
  if (accessKeyId && secretAccessKey) AWSAccount.DUMMY_ACCOUNT.createKeyPair(accessKeyId, secretAccessKey);
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
