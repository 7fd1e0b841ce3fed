import type { AuditEventDto } from '@rhotrace/api-types';
import { Op } from 'sequelize';
import { User } from '../users/user.model';
import type { AuditEvent } from './audit-event.model';
import { type NamedRecord, readableChanges, referencedIds } from './readable-change';
import { recordNames } from './record-names';

const NAMED: ReadonlySet<string> = new Set(['wafer', 'lot', 'station', 'user', 'sweep']);

/** Audit rows as the API answers them: actors' e-mails, the record's name, changes in words. */
export async function auditEventDtos(rows: readonly AuditEvent[]): Promise<AuditEventDto[]> {
  const actorIds = [
    ...new Set(rows.map((r) => r.actorId).filter((id): id is number => id !== null)),
  ];
  const actors = actorIds.length
    ? await User.findAll({ attributes: ['id', 'email'], where: { id: { [Op.in]: actorIds } } })
    : [];
  const emails = new Map(actors.map((u) => [u.id, u.email]));

  const ids = referencedIds(rows.flatMap((r) => [r.before, r.after]));
  for (const r of rows) {
    if (NAMED.has(r.entity) && /^\d+$/.test(r.entityId)) {
      ids[r.entity as NamedRecord].add(Number(r.entityId));
    }
  }
  const names = await recordNames(ids);
  const recordName = (r: AuditEvent): string | null => {
    if (NAMED.has(r.entity)) {
      const name = names[r.entity as NamedRecord].get(Number(r.entityId));
      return name ? `${r.entity} ${name}` : null;
    }
    if (r.entity === 'assignment') {
      const state = (r.after ?? r.before) as { waferId?: unknown } | null;
      const wafer = typeof state?.waferId === 'number' ? names.wafer.get(state.waferId) : null;
      return wafer ? `task on wafer ${wafer}` : null;
    }
    return null;
  };
  return rows.map((r) => ({
    id: Number(r.id),
    actorId: r.actorId,
    actorEmail: r.actorId === null ? null : (emails.get(r.actorId) ?? null),
    action: r.action,
    entity: r.entity,
    entityId: r.entityId,
    before: r.before,
    after: r.after,
    requestId: r.requestId,
    recordName: recordName(r),
    changes: readableChanges(r.before, r.after, names),
    createdAt: r.createdAt.toISOString(),
  }));
}
