import { Op } from 'sequelize';
import { Lot } from '../lots/lot.model';
import { Station } from '../stations/station.model';
import { Sweep } from '../sweeps/sweep.model';
import { User } from '../users/user.model';
import { Wafer } from '../wafers/wafer.model';
import type { NamedRecord, RecordNames } from './readable-change';

/**
 * The names of the records `ids` point to, one query per kind, deleted records included (the
 * trail outlives them): wafers as "W03 of lot L-7", lots by code, stations and people by name,
 * sweeps by file name.
 */
export async function recordNames(ids: Record<NamedRecord, Set<number>>): Promise<RecordNames> {
  const list = (kind: NamedRecord) => ({ [Op.in]: [...ids[kind]] });
  const wafers = ids.wafer.size
    ? await Wafer.findAll({ where: { id: list('wafer') }, paranoid: false })
    : [];
  for (const w of wafers) ids.lot.add(w.lotId);
  const [lots, stations, users, sweeps] = await Promise.all([
    ids.lot.size ? Lot.findAll({ where: { id: list('lot') }, paranoid: false }) : [],
    ids.station.size ? Station.findAll({ where: { id: list('station') }, paranoid: false }) : [],
    ids.user.size ? User.findAll({ attributes: ['id', 'name'], where: { id: list('user') } }) : [],
    ids.sweep.size
      ? Sweep.findAll({
          attributes: ['id', 'originalName'],
          where: { id: list('sweep') },
          paranoid: false,
        })
      : [],
  ]);
  const lotCodes = new Map(lots.map((l) => [l.id, l.code]));
  return {
    lot: lotCodes,
    wafer: new Map(
      wafers.map((w) => [w.id, `${w.number} of lot ${lotCodes.get(w.lotId) ?? w.lotId}`]),
    ),
    station: new Map(stations.map((s) => [s.id, s.name])),
    user: new Map(users.map((u) => [u.id, u.name])),
    sweep: new Map(sweeps.map((s) => [s.id, `${s.originalName} (sweep ${s.id})`])),
  };
}
