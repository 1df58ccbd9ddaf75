// Binds the audit trail to the app's database.
import { getDb } from '../db/client.server';
import { appendAuditEvent, type AuditInput } from '../db/queries/audit';
import type { RequestUser } from './http';

export function audit(e: AuditInput): Promise<void> {
  return appendAuditEvent(getDb(), e);
}

/** Audit an action by a signed-in user (or token holder). */
export function auditBy(
  user: RequestUser,
  action: string,
  testId: number | null,
  details: Record<string, unknown> = {},
): Promise<void> {
  return audit({
    userId: user.id,
    actor: user.email,
    action,
    testId,
    details: user.via === 'token' ? { ...details, via: 'api-token' } : details,
  });
}
