import {
  roleCan,
  SEARCH_KINDS,
  type SearchGroup,
  type SearchHit,
  type SearchKind,
  type SearchResponse,
  type SessionUser,
} from '@rhotrace/api-types';
import { Op, type WhereOptions } from 'sequelize';
import { visibleLots, visibleSweeps, visibleWafers } from '../access/visibility.service';
import { likePattern } from '../db/query';
import { Lot } from '../lots/lot.model';
import { Sweep } from '../sweeps/sweep.model';
import { User } from '../users/user.model';
import { Wafer } from '../wafers/wafer.model';

/** Hits of each kind shown when every kind is searched at once. */
const FIRST_HITS = 5;

interface Slice {
  q: string;
  page: number;
  pageSize: number;
}

const like = (q: string) => ({ [Op.like]: likePattern(q) });
const and = <T>(...parts: Array<WhereOptions<T>>): WhereOptions<T> => ({ [Op.and]: parts });

async function lots(user: SessionUser, s: Slice): Promise<SearchGroup> {
  const text = s.q ? { [Op.or]: [{ code: like(s.q) }, { material: like(s.q) }] } : {};
  const { rows, count } = await Lot.findAndCountAll({
    where: and<Lot>(visibleLots(user), text),
    order: [['code', 'ASC']],
    limit: s.pageSize,
    offset: (s.page - 1) * s.pageSize,
  });
  const items = rows.map<SearchHit>((l) => ({
    kind: 'lots',
    id: l.id,
    title: l.code,
    detail: [l.material, l.dopant].filter(Boolean).join(', '),
    waferId: null,
  }));
  return { kind: 'lots', items, total: count, page: s.page, pageSize: s.pageSize };
}

async function wafers(user: SessionUser, s: Slice): Promise<SearchGroup> {
  const matchingLots = s.q
    ? await Lot.findAll({ attributes: ['id'], where: { code: like(s.q) } })
    : [];
  const text = s.q
    ? { [Op.or]: [{ number: like(s.q) }, { lotId: { [Op.in]: matchingLots.map((l) => l.id) } }] }
    : {};
  const { rows, count } = await Wafer.findAndCountAll({
    where: and<Wafer>(visibleWafers(user), text),
    order: [
      ['lotId', 'DESC'],
      ['number', 'ASC'],
    ],
    limit: s.pageSize,
    offset: (s.page - 1) * s.pageSize,
  });
  const codes = await lotCodes(rows.map((w) => w.lotId));
  const items = rows.map<SearchHit>((w) => ({
    kind: 'wafers',
    id: w.id,
    title: w.number,
    detail: `lot ${codes.get(w.lotId) ?? w.lotId}, ${w.state}`,
    waferId: w.id,
  }));
  return { kind: 'wafers', items, total: count, page: s.page, pageSize: s.pageSize };
}

async function sweeps(user: SessionUser, s: Slice): Promise<SearchGroup> {
  const { rows, count } = await Sweep.findAndCountAll({
    attributes: ['id', 'waferId', 'originalName', 'method', 'pointCount', 'createdAt'],
    where: and<Sweep>(visibleSweeps(user), s.q ? { originalName: like(s.q) } : {}),
    order: [['id', 'DESC']],
    limit: s.pageSize,
    offset: (s.page - 1) * s.pageSize,
  });
  const waferRows = await Wafer.findAll({
    attributes: ['id', 'number', 'lotId'],
    where: { id: { [Op.in]: [...new Set(rows.map((r) => r.waferId))] } },
  });
  const codes = await lotCodes(waferRows.map((w) => w.lotId));
  const waferOf = new Map(waferRows.map((w) => [w.id, w]));
  const items = rows.map<SearchHit>((r) => {
    const w = waferOf.get(r.waferId);
    return {
      kind: 'sweeps',
      id: r.id,
      title: r.originalName,
      detail:
        `wafer ${w?.number ?? r.waferId} of lot ${w ? (codes.get(w.lotId) ?? '') : ''}, ` +
        `${r.pointCount} points, stored ${r.createdAt.toISOString().slice(0, 10)}`,
      waferId: r.waferId,
    };
  });
  return { kind: 'sweeps', items, total: count, page: s.page, pageSize: s.pageSize };
}

async function people(s: Slice): Promise<SearchGroup> {
  const text = s.q ? { [Op.or]: [{ name: like(s.q) }, { email: like(s.q) }] } : {};
  const { rows, count } = await User.findAndCountAll({
    where: and<User>({ active: true }, text),
    order: [['name', 'ASC']],
    limit: s.pageSize,
    offset: (s.page - 1) * s.pageSize,
  });
  const items = rows.map<SearchHit>((u) => ({
    kind: 'people',
    id: u.id,
    title: u.name,
    detail: u.email,
    waferId: null,
    role: u.role,
  }));
  return { kind: 'people', items, total: count, page: s.page, pageSize: s.pageSize };
}

async function lotCodes(ids: number[]): Promise<Map<number, string>> {
  if (ids.length === 0) return new Map();
  const rows = await Lot.findAll({ attributes: ['id', 'code'], where: { id: [...new Set(ids)] } });
  return new Map(rows.map((l) => [l.id, l.code]));
}

/** The kinds a reader may search: people only for those who manage accounts or assign work. */
export function searchableKinds(user: SessionUser): SearchKind[] {
  const findsPeople =
    roleCan(user.role, 'users:manage') || roleCan(user.role, 'assignments:assign');
  return SEARCH_KINDS.filter((k) => k !== 'people' || findsPeople);
}

/** `GET /api/search`: records the reader may see whose names hold `q`. */
export async function search(
  user: SessionUser,
  query: { q: string; kind?: SearchKind; page: number; pageSize: number },
): Promise<SearchResponse> {
  const kinds = searchableKinds(user).filter((k) => !query.kind || k === query.kind);
  const slice: Slice = query.kind
    ? { q: query.q, page: query.page, pageSize: query.pageSize }
    : { q: query.q, page: 1, pageSize: FIRST_HITS };
  const run: Record<SearchKind, () => Promise<SearchGroup>> = {
    lots: () => lots(user, slice),
    wafers: () => wafers(user, slice),
    sweeps: () => sweeps(user, slice),
    people: () => people(slice),
  };
  const groups: SearchGroup[] = [];
  for (const kind of kinds) groups.push(await run[kind]());
  return { q: query.q, groups };
}
