import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AssignmentDto } from '@rhotrace/api-types';
import { documentProblems } from '../openapi/testing/document-validator';
import { createTestContext, type TestContext } from '../testing/test-context';
import { Assignment } from './assignment.model';
import { AssignmentPlan } from './assignment-plan.model';
import { CRYOGEN, DEFER_TO_LAB_RULES } from './assignment-safety';
import { engineering } from '../mail/templates/plan-summary';
import { OutgoingEmail } from '../mail/outgoing-email.model';

describe('a measurement plan attached to an assignment', () => {
  let ctx: TestContext;
  let waferId: number;
  let stationId: number;
  let tech: Awaited<ReturnType<TestContext['addUser']>>;
  const planFor = (wafer: number) => ({
    waferId: wafer,
    stationId,
    minK: 80,
    maxK: 300,
    count: 6,
    spacing: 'inverse',
    targetVoltageV: 0.01,
    maxVoltageV: 0.1,
    maxPowerW: 1e-3,
  });
  const assign = (extra: object) =>
    request(ctx.app)
      .post('/api/assignments')
      .set(ctx.auth('manager'))
      .send({ waferId, assigneeId: tech.user.id, task: 'Sweep', dueDate: '2031-03-01', ...extra });

  beforeAll(async () => {
    ctx = await createTestContext();
    const lot = await request(ctx.app).post('/api/lots').set(ctx.auth('manager')).send({
      code: 'PLAN-A',
      material: 'Si',
      dopant: 'P',
      dopantType: 'n',
      thicknessCm: 0.05,
      specMinOhmCm: 1,
      specMaxOhmCm: 3,
    });
    waferId = (
      await request(ctx.app)
        .post(`/api/lots/${lot.body.id}/wafers`)
        .set(ctx.auth('manager'))
        .send({ number: 'A1' })
    ).body.id;
    stationId = (
      await request(ctx.app).post('/api/stations').set(ctx.auth('manager')).send({
        name: 'Nitrogen stage',
        probeSpacingCm: 0.1,
        thermometer: 'platinum-rtd',
        rtdR0Ohm: 100,
        minTemperatureK: 77,
        maxTemperatureK: 420,
      })
    ).body.id;
    tech = await ctx.addUser('technician', 'Plan Reader');
  });
  afterAll(async () => {
    await ctx.close();
  });

  it('stores the computed plan, shows it in the queue and e-mails it', async () => {
    const res = await assign({ plan: planFor(waferId) });
    expect(res.status).toBe(201);
    const dto = res.body as AssignmentDto;
    expect(documentProblems('POST', '/assignments', 201, res.body)).toEqual([]);
    expect(dto.plan!.plan.steps).toHaveLength(6);
    expect(dto.plan!.request.minK).toBe(80);
    const queue = await request(ctx.app).get('/api/assignments?assignee=me').set(tech.header);
    const mine = (queue.body.items as AssignmentDto[]).find((a) => a.id === dto.id)!;
    expect(documentProblems('GET', '/assignments', 200, queue.body)).toEqual([]);
    expect(mine.plan!.plan).toEqual(dto.plan!.plan);
    // The e-mail as queued in the assignment's transaction (delivery is assignments.spec's).
    const queued = await OutgoingEmail.findOne({
      where: { relatedEntity: 'assignment', relatedId: String(dto.id) },
    });
    expect(queued!.toAddress).toBe(tech.user.email);
    const text = queued!.textBody;
    expect(text).toContain('Measurement plan:');
    expect(text).toContain('6 steps from 80.0 K to 300.0 K on Nitrogen stage');
    const first = dto.plan!.plan.steps[0]!;
    expect(text).toContain(`80.00 K`);
    expect(text).toContain(engineering(first.currentA, 'A'));
    // The plan's cryogen caution appears once, and the lab's rules stay last.
    expect(text.split(CRYOGEN.slice(0, 40)).length - 1).toBe(1);
    expect(text.trimEnd().endsWith(DEFER_TO_LAB_RULES)).toBe(true);
  });

  it('refuses a bad plan with the field named, storing nothing', async () => {
    const count = await Assignment.count();
    const plans = await AssignmentPlan.count();
    const low = await assign({ plan: { ...planFor(waferId), minK: 10 } });
    expect(low.status).toBe(400);
    expect(low.body.error.details[0].field).toBe('body.plan.minK');
    const zero = await assign({ plan: { ...planFor(waferId), maxPowerW: 0 } });
    expect(zero.body.error.details[0].field).toBe('body.plan.maxPowerW');
    const other = await assign({ plan: planFor(waferId + 1000) });
    expect(other.status).toBe(400);
    expect(other.body.error.details[0].field).toBe('body.plan.waferId');
    expect(await Assignment.count()).toBe(count);
    expect(await AssignmentPlan.count()).toBe(plans);
  });

  it('replaces and detaches the plan; the assignee may not change it', async () => {
    const created = (await assign({})).body as AssignmentDto;
    expect(created.plan).toBeNull();
    const patch = (body: object, header = ctx.auth('manager')) =>
      request(ctx.app).patch(`/api/assignments/${created.id}`).set(header).send(body);
    const attached = await patch({ plan: { ...planFor(waferId), count: 4 } });
    expect(attached.status).toBe(200);
    expect(attached.body.plan.plan.steps).toHaveLength(4);
    expect((await patch({ plan: null }, tech.header)).status).toBe(403);
    const detached = await patch({ plan: null });
    expect(detached.body.plan).toBeNull();
    expect(await AssignmentPlan.count({ where: { assignmentId: created.id } })).toBe(0);
  });
});

describe('engineering', () => {
  it('writes values with an SI prefix and three significant figures', () => {
    expect(engineering(4.532e-4, 'A')).toBe('453 µA');
    expect(engineering(0.01, 'V')).toBe('10 mV');
    expect(engineering(1.5, 'V')).toBe('1.5 V');
    expect(engineering(6.74e-7, 'A')).toBe('674 nA');
  });
});
