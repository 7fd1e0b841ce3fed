import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeLot } from '../analysis/testing/fixtures';
import { OutgoingEmail } from '../mail/outgoing-email.model';
import { createTestContext, type TestContext } from '../testing/test-context';
import { Assignment } from './assignment.model';
import { remindOverdue } from './overdue-reminders';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx.close());

async function task(waferId: number, state: string, dueDate: string) {
  return Assignment.create({
    waferId,
    assigneeId: ctx.users.technician.id,
    assignedById: ctx.users.manager.id,
    task: 'Measure rho(T)',
    dueDate,
    state,
    notes: null,
  } as never);
}

describe('overdue reminders', () => {
  it('queue one e-mail a day per overdue open task, however often or widely the chore runs', async () => {
    const { lot, wafers } = await makeLot({}, ['OD-1', 'OD-2', 'OD-3', 'OD-4']);
    const late = await task(wafers[0]!.id, 'in progress', '2026-11-28');
    await task(wafers[1]!.id, 'done', '2026-11-28'); // finished: no reminder
    await task(wafers[2]!.id, 'assigned', '2026-12-05'); // due today: not overdue yet
    await task(wafers[3]!.id, 'cancelled', '2026-11-01');
    const mail = { mailer: ctx.mailer, publicUrl: 'http://rhotrace.test' };

    // Two instances running the chore at once on the same day.
    const [a, b] = await Promise.all([
      remindOverdue(mail, '2026-12-05'),
      remindOverdue(mail, '2026-12-05'),
    ]);
    const mine = () =>
      OutgoingEmail.findAll({ where: { relatedEntity: 'assignment', relatedId: late.id } });
    expect(a + b).toBeGreaterThanOrEqual(1);
    expect(await mine()).toHaveLength(1);
    expect(await remindOverdue(mail, '2026-12-05')).toBe(0);
    const [first] = await mine();
    expect(first!.toAddress).toBe(ctx.users.technician.email);
    expect(first!.subject).toBe(`Rhotrace: overdue by 7 days: wafer OD-1 (lot ${lot.code})`);
    expect(first!.textBody).toContain('This task was due on 2026-11-28 and is still open');

    // The next day it comes again; once done, never.
    await remindOverdue(mail, '2026-12-06');
    expect(await mine()).toHaveLength(2);
    await late.update({ state: 'done' });
    await remindOverdue(mail, '2026-12-07');
    expect(await mine()).toHaveLength(2);
    expect(first!.textBody).toContain(`http://rhotrace.test/wafers/${wafers[0]!.id}`);
  });
});
