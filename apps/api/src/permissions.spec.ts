/**
 * The permission matrix: every route against every role (and no token), expecting the status
 * each role is meant to get. One row per route; read it as a table.
 *
 * Placeholders in paths (`:lot`, `:wafer`…) are fixture ids made in `beforeAll`; a row with
 * `fresh` gets a new record per request (deletes, state changes), so each role meets the same
 * starting point. Technicians see only wafers assigned to them (and those lots): elsewhere 404.
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '@rhotrace/api-types';
import { Assignment } from './assignments/assignment.model';
import { Lot } from './lots/lot.model';
import { Station } from './stations/station.model';
import { createTestContext, type TestContext } from './testing/test-context';
import { Wafer } from './wafers/wafer.model';

type Who = Role | 'none';
const WHO: Who[] = ['admin', 'manager', 'engineer', 'physicist', 'technician', 'none'];

/** Expected status per caller, in the order of WHO: admin, manager, engineer, physicist, technician, none. */
type Expect = [number, number, number, number, number, number];

interface Row {
  method: 'get' | 'post' | 'patch' | 'delete';
  path: string;
  body?: () => object;
  /** Makes a record for this one request; its id replaces `:fresh` in the path. */
  fresh?: () => Promise<number>;
  expect: Expect;
}

let seq = 0;
const unique = () => `${Date.now().toString(36)}-${++seq}`;
let fx: Record<string, number> = {};

// prettier-ignore
const newLot = async () => (await Lot.create({ code: `FRESH-${unique()}`, material: 'Si', dopant: null, dopantType: null, orientation: null, diameterCm: null, thicknessCm: null, supplier: null, receivedOn: null, specMinOhmCm: null, specMaxOhmCm: null, notes: null, createdById: null })).id;
// prettier-ignore
const newWafer = async () => (await Wafer.create({ lotId: fx.lot!, number: `F-${unique()}`, thicknessCm: null, notes: null })).id;
// prettier-ignore
const newStation = async () => (await Station.create({ name: `Fresh ${unique()}`, probeSpacingCm: 0.1, tipRadiusCm: null, thermometer: 'thermocouple', rtdR0Ohm: null, minTemperatureK: 80, maxTemperatureK: 400, calibratedOn: null, notes: null })).id;
// prettier-ignore
const newTechAssignment = async () => (await Assignment.create({ waferId: fx.wafer!, assigneeId: fx.technician!, assignedById: fx.manager!, task: 'Measure', dueDate: '2031-01-01', notes: null })).id;

// prettier-ignore
//                                                                     admin mgr  eng  phys tech none
const MATRIX: Row[] = [
  // auth: open routes and the session
  { method: 'get', path: '/api/auth/me', expect:                        [200, 200, 200, 200, 200, 401] },
  { method: 'post', path: '/api/auth/refresh', expect:                  [200, 200, 200, 200, 200, 401] },
  { method: 'post', path: '/api/auth/password-reset', body: () => ({ email: `n-${unique()}@test.rhotrace.example` }), expect: [202, 202, 202, 202, 202, 202] },
  { method: 'post', path: '/api/auth/password-reset/confirm', body: () => ({ token: 'not-a-token', password: 'long-enough-pass' }), expect: [400, 400, 400, 400, 400, 400] },
  // users: admin only, the assignee picker also for managers
  { method: 'get', path: '/api/users', expect:                          [200, 403, 403, 403, 403, 401] },
  { method: 'get', path: '/api/users/assignees', expect:                [200, 200, 403, 403, 403, 401] },
  { method: 'post', path: '/api/users', body: () => ({ email: `u-${unique()}@test.rhotrace.example`, name: 'New person', role: 'technician', password: 'a-long-password' }), expect: [201, 403, 403, 403, 403, 401] },
  { method: 'get', path: '/api/users/:user', expect:                    [200, 403, 403, 403, 403, 401] },
  { method: 'patch', path: '/api/users/:user', body: () => ({ name: 'Renamed' }), expect: [200, 403, 403, 403, 403, 401] },
  // lots
  { method: 'get', path: '/api/lots', expect:                           [200, 200, 200, 200, 200, 401] },
  { method: 'post', path: '/api/lots', body: () => ({ code: `P-${unique()}`, material: 'Si' }), expect: [201, 201, 201, 403, 403, 401] },
  { method: 'get', path: '/api/lots/:lot', expect:                      [200, 200, 200, 200, 200, 401] },
  { method: 'get', path: '/api/lots/:hiddenLot', expect:                [200, 200, 200, 200, 404, 401] },
  { method: 'patch', path: '/api/lots/:lot', body: () => ({ supplier: `S ${unique()}` }), expect: [200, 200, 200, 403, 403, 401] },
  { method: 'delete', path: '/api/lots/:fresh', fresh: newLot, expect:  [204, 204, 204, 403, 403, 401] },
  // wafers
  { method: 'get', path: '/api/lots/:lot/wafers', expect:               [200, 200, 200, 200, 200, 401] },
  { method: 'get', path: '/api/lots/:hiddenLot/wafers', expect:         [200, 200, 200, 200, 404, 401] },
  { method: 'post', path: '/api/lots/:lot/wafers', body: () => ({ number: `N-${unique()}` }), expect: [201, 201, 201, 403, 403, 401] },
  { method: 'get', path: '/api/wafers', expect:                         [200, 200, 200, 200, 200, 401] },
  { method: 'get', path: '/api/wafers/:wafer', expect:                  [200, 200, 200, 200, 200, 401] },
  { method: 'get', path: '/api/wafers/:hiddenWafer', expect:            [200, 200, 200, 200, 404, 401] },
  { method: 'patch', path: '/api/wafers/:wafer', body: () => ({ notes: unique() }), expect: [200, 200, 200, 403, 403, 401] },
  { method: 'delete', path: '/api/wafers/:fresh', fresh: newWafer, expect: [204, 204, 204, 403, 403, 401] },
  // probe stations
  { method: 'get', path: '/api/stations', expect:                       [200, 200, 200, 200, 200, 401] },
  { method: 'post', path: '/api/stations', body: () => ({ name: `St ${unique()}`, probeSpacingCm: 0.1, thermometer: 'platinum-rtd', rtdR0Ohm: 100, minTemperatureK: 77, maxTemperatureK: 450 }), expect: [201, 201, 201, 403, 403, 401] },
  { method: 'get', path: '/api/stations/:station', expect:              [200, 200, 200, 200, 200, 401] },
  { method: 'patch', path: '/api/stations/:station', body: () => ({ notes: unique() }), expect: [200, 200, 200, 403, 403, 401] },
  { method: 'delete', path: '/api/stations/:fresh', fresh: newStation, expect: [204, 204, 204, 403, 403, 401] },
  // assignments
  { method: 'get', path: '/api/assignments', expect:                    [200, 200, 200, 200, 200, 401] },
  { method: 'get', path: '/api/assignments?assignee=me', expect:        [200, 200, 200, 200, 200, 401] },
  { method: 'get', path: '/api/assignments?assignee=:manager', expect:  [200, 200, 200, 200, 403, 401] },
  { method: 'post', path: '/api/assignments', body: () => ({ waferId: fx.wafer, assigneeId: fx.technician, task: 'Measure', dueDate: '2031-06-01' }), expect: [201, 201, 403, 403, 403, 401] },
  { method: 'get', path: '/api/assignments/overdue', expect:            [200, 200, 403, 403, 403, 401] },
  { method: 'get', path: '/api/assignments/:assignment', expect:        [200, 200, 200, 200, 200, 401] },
  { method: 'get', path: '/api/assignments/:otherAssignment', expect:   [200, 200, 200, 200, 404, 401] },
  { method: 'patch', path: '/api/assignments/:assignment', body: () => ({ notes: unique() }), expect: [200, 200, 403, 403, 403, 401] },
  { method: 'patch', path: '/api/assignments/:fresh', fresh: newTechAssignment, body: () => ({ state: 'in progress' }), expect: [200, 200, 403, 403, 200, 401] },
  // audit trail
  { method: 'get', path: '/api/audit', expect:                          [200, 200, 403, 403, 403, 401] },
  { method: 'get', path: '/api/audit?entity=lot&id=:lot', expect:       [200, 200, 403, 403, 403, 401] },
  // development mail page (not mounted in production)
  { method: 'get', path: '/api/dev/mail', expect:                       [200, 200, 200, 200, 200, 200] },

  // ── sweep import, fits, analysis and reports: append your rows below this line ──
  // measurement planner: roles with plans:make
  { method: 'post', path: '/api/planner', body: () => ({ stationId: fx.station, material: 'Si', doping: { donorDensity: 1e15, acceptorDensity: 0 }, thicknessCm: 0.05, minK: 100, maxK: 300, count: 5, spacing: 'linear', targetVoltageV: 0.01, maxVoltageV: 0.1, maxPowerW: 0.001 }), expect: [200, 200, 200, 200, 403, 401] },
];

describe('permission matrix: every route against every role', () => {
  let ctx: TestContext;
  beforeAll(async () => {
    ctx = await createTestContext();
    const lot = await newLotWithCode('MATRIX-LOT');
    const hiddenLot = await newLotWithCode('MATRIX-HIDDEN');
    fx = { lot, hiddenLot, technician: ctx.users.technician.id, manager: ctx.users.manager.id };
    fx.wafer = await newWafer();
    fx.hiddenWafer = (
      await Wafer.create({ lotId: hiddenLot, number: 'H1', thicknessCm: null, notes: null })
    ).id;
    fx.station = await newStation();
    fx.assignment = await newTechAssignment();
    const other = await ctx.addUser('technician');
    fx.otherAssignment = (
      await Assignment.create({
        waferId: fx.hiddenWafer,
        assigneeId: other.user.id,
        assignedById: fx.manager!,
        task: 'Other',
        dueDate: '2031-01-01',
        notes: null,
      })
    ).id;
    fx.user = (await ctx.addUser('engineer')).user.id;
  });
  afterAll(async () => {
    await ctx.close();
  });

  async function newLotWithCode(code: string) {
    const id = await newLot();
    await Lot.update({ code }, { where: { id } });
    return id;
  }

  it('answers every route with the expected status for every role', async () => {
    const expected: string[] = [];
    const actual: string[] = [];
    for (const row of MATRIX) {
      const got: number[] = [];
      for (const who of WHO) {
        const ids: Record<string, number> = {
          ...fx,
          ...(row.fresh ? { fresh: await row.fresh() } : {}),
        };
        const path = row.path.replace(/:([a-zA-Z]+)/g, (m, name: string) =>
          name in ids ? String(ids[name]) : m,
        );
        let req = request(ctx.app)[row.method](path);
        if (who !== 'none') req = req.set(ctx.auth(who));
        const res = await (row.body ? req.send(row.body()) : req);
        got.push(res.status);
      }
      const label = `${row.method.toUpperCase().padEnd(6)} ${row.path.padEnd(44)}`;
      expected.push(`${label} ${row.expect.join(' ')}`);
      actual.push(`${label} ${got.join(' ')}`);
    }
    expect(actual.join('\n')).toBe(expected.join('\n'));
    // Several hundred requests in one test: about 5 s on a quiet machine, several times that on a
    // saturated one, so it gets more than the suite's 30 s default (a limit, not a timing check).
  }, 120_000);
});
