import type { AuditEventDto, Page, SessionUser } from '@rhotrace/api-types';
import { Op, type WhereOptions } from 'sequelize';
import { visibleLot, visibleWafer } from '../access/visibility.service';
import { Assignment } from '../assignments/assignment.model';
import { notFound } from '../errors';
import { Station } from '../stations/station.model';
import { Sweep } from '../sweeps/sweep.model';
import { AuditEvent } from './audit-event.model';
import { auditEventDtos } from './audit-events';

/** The records whose history has its own page. */
export type HistoryOf = 'lot' | 'wafer' | 'station';

/**
 * The trail of one record for anyone who may see the record, newest first: a lot's own changes;
 * a wafer's, its tasks' and its sweeps'; a station's. Hidden or missing records are 404.
 */
export async function recordHistory(
  user: SessionUser,
  of: HistoryOf,
  id: number,
  page: { page: number; pageSize: number },
): Promise<Page<AuditEventDto>> {
  const own: WhereOptions<AuditEvent> = { entity: of, entityId: String(id) };
  let where: WhereOptions<AuditEvent> = own;
  if (of === 'lot') await visibleLot(user, id);
  if (of === 'station' && !(await Station.findByPk(id))) throw notFound(`Station ${id}`);
  if (of === 'wafer') {
    await visibleWafer(user, id);
    const [tasks, sweeps] = await Promise.all([
      Assignment.findAll({ attributes: ['id'], where: { waferId: id } }),
      Sweep.findAll({ attributes: ['id'], where: { waferId: id }, paranoid: false }),
    ]);
    where = {
      [Op.or]: [
        own,
        { entity: 'assignment', entityId: { [Op.in]: tasks.map((t) => String(t.id)) } },
        { entity: 'sweep', entityId: { [Op.in]: sweeps.map((s) => String(s.id)) } },
      ],
    };
  }
  const { rows, count } = await AuditEvent.findAndCountAll({
    where,
    order: [['id', 'DESC']],
    limit: page.pageSize,
    offset: (page.page - 1) * page.pageSize,
  });
  return { items: await auditEventDtos(rows), total: count, ...page };
}
