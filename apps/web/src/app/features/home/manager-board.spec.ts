import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { AssignmentDto, AssignmentState } from '@rhotrace/api-types';
import { ManagerBoard } from './manager-board';

const task = (id: number, state: AssignmentState, overdue: boolean): AssignmentDto => ({
  id,
  waferId: 100 + id,
  waferNumber: `W${String(id).padStart(2, '0')}`,
  lotCode: 'LV-26-B014',
  assigneeId: 5,
  assigneeName: 'Juno',
  assignedById: 2,
  task: `Sweep ${id}`,
  dueDate: `2026-11-${String(id).padStart(2, '0')}`,
  state,
  notes: null,
  overdue,
  createdAt: '2026-11-01T08:00:00.000Z',
  updatedAt: `2026-11-${String(id).padStart(2, '0')}T08:00:00.000Z`,
});

describe('ManagerBoard', () => {
  it('shows overdue tasks first and links a long group to all of its items', async () => {
    TestBed.configureTestingModule({
      imports: [ManagerBoard],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    const http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ManagerBoard);
    fixture.detectChanges();
    // soonest due first, as the board asks: eight overdue, two open, one done
    const items = [
      ...Array.from({ length: 8 }, (_, i) => task(i + 1, 'assigned', true)),
      task(20, 'in progress', false),
      task(21, 'assigned', false),
      task(22, 'done', false),
    ];
    http
      .expectOne((r) => r.url === '/api/assignments' && r.params.get('sort') === 'dueDate')
      .flush({ items, total: items.length, page: 1, pageSize: 200 });
    await fixture.whenStable();
    const root = fixture.nativeElement as HTMLElement;

    const headings = [...root.querySelectorAll('h3')].map((h) => h.textContent?.trim());
    expect(headings).toEqual(['Overdue', 'Open', 'Recently finished']);
    const overdue = root.querySelectorAll('[aria-label="Overdue"] li');
    expect(overdue).toHaveLength(6);
    expect(overdue[0]!.textContent).toContain('Wafer W01');
    // the two beyond the first six are one link away, not cut off without a word
    const more = [...root.querySelectorAll('a.more')];
    expect(more.map((a) => a.textContent?.trim())).toEqual(['All 8 overdue in the worklist']);
    expect(more[0]!.getAttribute('href')).toBe('/worklist');
    expect(root.querySelectorAll('[aria-label="Open"] li')).toHaveLength(2);
  });
});
