// Starts the local services Hoopline needs — a private MariaDB, the S3 fake and the SMTP fake —
// keeps them up until SIGINT/SIGTERM, then stops them. Writes `ready` into STATE_FILE when up.
// Usage: node fake-services/run.mjs [--data DIR] [--db-port N] [--s3-port N] [--smtp-port N]
//        [--db-password P] [--s3-access-key K --s3-secret-key S]   (credentials other than the defaults)
import { writeFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { parseArgs } from 'node:util';
import { startMariaDB, stopMariaDB } from './mariadb.mjs';
import { startS3 } from './s3.mjs';
import { startSmtp } from './smtp.mjs';

const { values } = parseArgs({
  options: {
    data: { type: 'string', default: '.data' },
    'db-port': { type: 'string', default: '3407' },
    's3-port': { type: 'string', default: '4569' },
    'smtp-port': { type: 'string', default: '2526' },
    bucket: { type: 'string', default: process.env.S3_BUCKET || 'hoopline-logs' },
    'db-password': { type: 'string' },
    's3-access-key': { type: 'string' },
    's3-secret-key': { type: 'string' },
  },
});
const data = path.resolve(values.data);
const stateFile = path.join(data, 'services.state');

const db = await startMariaDB({
  dataDir: path.join(data, 'mariadb'),
  port: Number(values['db-port']),
  password: values['db-password'],
});
console.log(
  `MariaDB   ${db.alreadyRunning ? 'already running' : 'started'} on 127.0.0.1:${db.port} (data ${path.join(data, 'mariadb')})`,
);
const s3 = await startS3({
  directory: path.join(data, 's3'),
  port: Number(values['s3-port']),
  bucket: values.bucket,
  accessKeyId: values['s3-access-key'],
  secretAccessKey: values['s3-secret-key'],
});
console.log(`S3 fake   on ${s3.endpoint} (bucket ${values.bucket}, objects under ${path.join(data, 's3')})`);
const smtp = await startSmtp({ directory: path.join(data, 'mail'), port: Number(values['smtp-port']) });
console.log(`SMTP fake on 127.0.0.1:${smtp.port} (messages under ${path.join(data, 'mail')})`);
writeFileSync(stateFile, 'ready\n');

let stopping = false;
async function stop() {
  if (stopping) return;
  stopping = true;
  rmSync(stateFile, { force: true });
  await Promise.allSettled([s3.close(), smtp.close()]);
  if (!db.alreadyRunning) await stopMariaDB({ dataDir: path.join(data, 'mariadb') });
  console.log('local services stopped');
  process.exit(0);
}
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
