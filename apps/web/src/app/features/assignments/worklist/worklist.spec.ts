import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { Component, input, output } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatSelectHarness } from '@angular/material/select/testing';
import { provideRouter } from '@angular/router';
import type { AssignmentDto, UpdateAssignmentRequest } from '@rhotrace/api-types';
import { of } from 'rxjs';
import { provideIsoDateAdapter } from '../../../shared/iso-date';
import { AssignmentsApi } from '../assignments-api';
import { AssignForm } from './assign-form';
import { Worklist } from './worklist';

@Component({ selector: 'rt-assign-form', template: '' })
class NoForm {
  readonly preselectWaferId = input<number | null>(null);
  readonly created = output<AssignmentDto>();
}

const task = {
  id: 5,
  waferId: 14,
  waferNumber: 'W03',
  lotCode: 'L-7',
  assigneeId: 2,
  assigneeName: 'Tom Tech',
  assignedById: 1,
  task: 'Measure rho(T)',
  dueDate: '2026-12-01',
  state: 'assigned',
  notes: null,
  overdue: true,
  sweeps: [{ id: 41, originalName: 'W03-cryo.csv', createdAt: '2026-11-29T10:00:00.000Z' }],
  createdAt: '2026-11-20T00:00:00.000Z',
  updatedAt: '2026-11-20T00:00:00.000Z',
} as AssignmentDto;

class FakeApi {
  readonly updates: Array<{ id: number; body: UpdateAssignmentRequest }> = [];
  list() {
    return of({ items: [task], total: 1, page: 1, pageSize: 25 });
  }
  stations() {
    return of([]);
  }
  assignees() {
    return of([
      { id: 2, name: 'Tom Tech', email: 't@lab.example', role: 'technician' },
      { id: 3, name: 'Tia Tech', email: 'tia@lab.example', role: 'technician' },
    ]);
  }
  update(id: number, body: UpdateAssignmentRequest) {
    this.updates.push({ id, body });
    return of({ ...task, ...body, assigneeName: body.assigneeId === 3 ? 'Tia Tech' : 'Tom Tech' });
  }
}

async function setup() {
  const api = new FakeApi();
  TestBed.configureTestingModule({
    imports: [Worklist],
    providers: [
      provideRouter([]),
      { provide: AssignmentsApi, useValue: api },
      { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
      provideIsoDateAdapter(),
    ],
  });
  TestBed.overrideComponent(Worklist, {
    remove: { imports: [AssignForm] },
    add: { imports: [NoForm] },
  });
  const fixture = TestBed.createComponent(Worklist);
  await fixture.whenStable();
  return { api, fixture, loader: TestbedHarnessEnvironment.loader(fixture) };
}

describe('Worklist', () => {
  it('lists the sweeps that fulfil a task', async () => {
    const { fixture } = await setup();
    const link = [...(fixture.nativeElement as HTMLElement).querySelectorAll('a')].find(
      (a) => a.textContent?.trim() === 'W03-cryo.csv',
    );
    expect(link?.getAttribute('href')).toBe('/sweeps/41');
  });

  it('hands a task to another person from its row', async () => {
    const { api, loader } = await setup();
    const who = await loader.getHarness(
      MatSelectHarness.with({ selector: '[aria-label="Who measures L-7 W03"]' }),
    );
    await who.open();
    await who.clickOptions({ text: 'Tia Tech' });
    expect(api.updates).toEqual([{ id: 5, body: { assigneeId: 3 } }]);
  });

  it('moves the due date from its row as YYYY-MM-DD, ignoring an emptied field', async () => {
    const { api, fixture } = await setup();
    const due = (fixture.nativeElement as HTMLElement).querySelector<HTMLInputElement>(
      'input[aria-label="When L-7 W03 is due"]',
    )!;
    const type = (text: string) => {
      due.value = text;
      due.dispatchEvent(new Event('input'));
      due.dispatchEvent(new Event('change'));
    };
    expect(due.value).toBe('2026-12-01');
    type('');
    type('12/05/2026');
    await fixture.whenStable();
    expect(document.body.textContent).toContain(
      'Write the date as YYYY-MM-DD, e.g. 2026-12-05 ("12/05/2026" is not).',
    );
    type('2026-12-12');
    expect(api.updates).toEqual([{ id: 5, body: { dueDate: '2026-12-12' } }]);
  });
});
