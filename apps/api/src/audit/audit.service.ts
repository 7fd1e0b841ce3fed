import type { AuditEventDto, Page } from '@rhotrace/api-types';
import { auditEventDtos } from './audit-events';
import { QueryTypes, type Transaction, type WhereOptions } from 'sequelize';
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

/** An SQL condition with its `?` replacements. */
export interface SqlCondition {
  sql: string;
  replacements: unknown[];
}

/**
 * `recordAudit` only when `condition` holds inside `transaction`, in one statement
 * (INSERT ... SELECT ... WHERE condition), so the event can only be written where the change it
 * records is visible. Resolves with the number of events written (1 or 0).
 */
export async function recordAuditWhen(
  entry: AuditEntry,
  condition: SqlCondition,
  transaction: Transaction,
): Promise<number> {
  const json = (value: unknown) =>
    value === undefined || value === null ? null : JSON.stringify(value);
  const [, affectedRows] = await AuditEvent.sequelize!.query(
    'INSERT INTO `audit_events` (actor_id, action, entity, entity_id, `before`, `after`, request_id, ' +
      `created_at) SELECT ?, ?, ?, ?, ?, ?, ?, ? FROM DUAL WHERE ${condition.sql}`,
    {
      replacements: [
        entry.actorId,
        entry.action,
        entry.entity,
        String(entry.entityId),
        json(entry.before),
        json(entry.after),
        entry.requestId ?? null,
        new Date(),
        ...condition.replacements,
      ],
      type: QueryTypes.INSERT,
      transaction,
    },
  );
  return affectedRows;
}

/**
 * `recordAudit` for a change made by `actor` (null for the system, e.g. the demo seeder): the
 * actor and the request id come from it, the record's states before and after (either left out
 * for a creation or a deletion) from `states`.
 */
export function auditChange(
  transaction: Transaction,
  actor: Actor | null,
  action: AuditEntry['action'],
  entity: string,
  entityId: number | string,
  states: { before?: unknown; after?: unknown },
): Promise<void> {
  return recordAudit(
    {
      actorId: actor?.id ?? null,
      action,
      entity,
      entityId,
      ...states,
      requestId: actor?.requestId ?? null,
    },
    transaction,
  );
}

/** Filters of `GET /api/audit`. */
export interface AuditListOptions {
  page: number;
  pageSize: number;
  entity?: string;
  id?: string;
  actorId?: number;
  action?: string;
}

/** A page of the trail, newest first, with each actor's e-mail and the changes in words. */
export async function listAudit(options: AuditListOptions): Promise<Page<AuditEventDto>> {
  const where: WhereOptions<AuditEvent> = {
    ...(options.entity ? { entity: options.entity } : {}),
    ...(options.id ? { entityId: options.id } : {}),
    ...(options.actorId ? { actorId: options.actorId } : {}),
    ...(options.action ? { action: options.action } : {}),
  };
  const { rows, count } = await AuditEvent.findAndCountAll({
    where,
    order: [['id', 'DESC']],
    limit: options.pageSize,
    offset: (options.page - 1) * options.pageSize,
  });
  return {
    items: await auditEventDtos(rows),
    total: count,
    page: options.page,
    pageSize: options.pageSize,
  };
}
