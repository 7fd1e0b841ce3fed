import type { Transaction } from 'sequelize';
import { AuditEvent } from './audit-event.model';

export interface AuditEntry {
  actorId: number | null;
  action: 'create' | 'update' | 'delete' | 'restore' | 'sign-in' | 'password-reset' | string;
  entity: string;
  entityId: number | string;
  before?: unknown;
  after?: unknown;
  requestId?: string | null;
}

/** Context every change carries: who does it, in which request. */
export interface Actor {
  id: number;
  requestId?: string | null;
}

/**
 * Writes one audit event inside `transaction`, so the event and the change it records commit
 * or roll back together.
 */
export async function recordAudit(entry: AuditEntry, transaction: Transaction): Promise<void> {
  await AuditEvent.create(
    {
      actorId: entry.actorId,
      action: entry.action,
      entity: entry.entity,
      entityId: String(entry.entityId),
      before: entry.before ?? null,
      after: entry.after ?? null,
      requestId: entry.requestId ?? null,
    },
    { transaction },
  );
}
