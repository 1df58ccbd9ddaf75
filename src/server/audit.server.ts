// Binds the audit trail to the app's database. Pass the transaction of the change being
// recorded, so the change and its audit row commit together (DESIGN 6).
import type { Conn } from '../db/client.server';
import { appendAuditEvent, type AuditInput } from '../db/queries/audit';
import type { RequestUser } from './http';

export function audit(db: Conn, e: AuditInput): Promise<void> {
  return appendAuditEvent(db, e);
}

/** Audit an action by a signed-in user (or token holder). */
export function auditBy(
  db: Conn,
  user: RequestUser,
  action: string,
  testId: number | null,
  details: Record<string, unknown> = {},
): Promise<void> {
  return audit(db, {
    userId: user.id,
    actor: user.email,
    action,
    testId,
    details: user.via === 'token' ? { ...details, via: 'api-token' } : details,
  });
}
