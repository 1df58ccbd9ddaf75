// Secrets at rest (DESIGN 6): e-mail bodies in the outbox hold share and invitation links, so
// they are stored encrypted with AES-256-GCM under a key derived (HKDF-SHA-256) from AUTH_SECRET.
// A database dump alone gives no working link. Changing AUTH_SECRET makes queued mail unreadable
// (it is then marked failed with a message saying so).
import { createCipheriv, createDecipheriv, hkdfSync, randomBytes } from 'node:crypto';
import { getConfig } from '../config.server';

const PREFIX = 'v1.';
let cached: { secret: string; key: Buffer } | null = null;

function key(purpose: string): Buffer {
  const secret = getConfig().AUTH_SECRET;
  if (!secret) throw new Error('AUTH_SECRET is not set: it is needed to encrypt mail in the outbox');
  if (cached?.secret !== secret + purpose)
    cached = {
      secret: secret + purpose,
      key: Buffer.from(hkdfSync('sha256', secret, 'hoopline', `hoopline ${purpose}`, 32)),
    };
  return cached.key;
}

/** `v1.` + base64url(iv ‖ tag ‖ ciphertext). */
export function sealText(plain: string, purpose = 'outbox v1'): string {
  const iv = randomBytes(12);
  const cipher = createCipheriv('aes-256-gcm', key(purpose), iv);
  const ct = Buffer.concat([cipher.update(plain, 'utf8'), cipher.final()]);
  return PREFIX + Buffer.concat([iv, cipher.getAuthTag(), ct]).toString('base64url');
}

/** The plain text of a sealed value; throws when it was sealed under another key or altered. */
export function openText(sealed: string, purpose = 'outbox v1'): string {
  if (!sealed.startsWith(PREFIX)) return sealed; // written before bodies were sealed
  const raw = Buffer.from(sealed.slice(PREFIX.length), 'base64url');
  const decipher = createDecipheriv('aes-256-gcm', key(purpose), raw.subarray(0, 12));
  decipher.setAuthTag(raw.subarray(12, 28));
  return Buffer.concat([decipher.update(raw.subarray(28)), decipher.final()]).toString('utf8');
}

export const isSealed = (value: string) => value.startsWith(PREFIX);
