// Local SMTP fake: accepts every message on loopback and writes it as an .eml file.
// The app sends through nodemailer configured by env, so a real relay works by env alone.
import { SMTPServer } from 'smtp-server';
import { mkdirSync, createWriteStream } from 'node:fs';
import { randomUUID } from 'node:crypto';
import path from 'node:path';

/** Start the SMTP fake on 127.0.0.1:port; messages land in `directory` as <time>-<uuid>.eml. */
export async function startSmtp({ directory, port }) {
  mkdirSync(directory, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, _session, callback) {
      const name = `${new Date().toISOString().replace(/[:.]/g, '-')}-${randomUUID()}.eml`;
      const out = createWriteStream(path.join(directory, name));
      stream.pipe(out);
      stream.on('end', () => out.end(() => callback()));
      stream.on('error', callback);
    },
  });
  await new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => resolve(undefined));
  });
  const actual = server.server.address().port;
  return { port: actual, close: () => new Promise((r) => server.close(() => r(undefined))) };
}
