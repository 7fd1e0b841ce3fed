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
  it('shows overdue tasks first, counts every task and links a long group to all of its items', async () => {
    TestBed.configureTestingModule({
      imports: [ManagerBoard],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
    });
    const http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ManagerBoard);
    fixture.detectChanges();
    // Each group is asked for with its own filter and page: 250 overdue (more than any one
    // page holds), two open, 40 done; the server answers the first six of each and the total.
    const late = Array.from({ length: 6 }, (_, i) => task(i + 1, 'assigned', true));
    const open = [task(20, 'in progress', false), task(21, 'assigned', false)];
    const done = Array.from({ length: 6 }, (_, i) => task(30 + i, 'done', false));
    const asked = http.match((r) => r.url === '/api/assignments');
    const params = (i: number) =>
      Object.fromEntries(
        asked[i]!.request.params.keys().map((k) => [k, asked[i]!.request.params.get(k)]),
      );
    expect(asked.map((_, i) => params(i))).toEqual([
      { overdue: 'true', sort: 'dueDate', pageSize: '6' },
      { open: 'true', overdue: 'false', sort: 'dueDate', pageSize: '6' },
      { state: 'done', sort: '-updatedAt', pageSize: '6' },
    ]);
    asked[0]!.flush({ items: late, total: 250, page: 1, pageSize: 6 });
    asked[1]!.flush({ items: open, total: 2, page: 1, pageSize: 6 });
    asked[2]!.flush({ items: done, total: 40, page: 1, pageSize: 6 });
    await fixture.whenStable();
    const root = fixture.nativeElement as HTMLElement;

    const headings = [...root.querySelectorAll('h3')].map((h) => h.textContent?.trim());
    expect(headings).toEqual(['Overdue', 'Open', 'Recently finished']);
    const overdue = root.querySelectorAll('[aria-label="Overdue"] li');
    expect(overdue).toHaveLength(6);
    expect(overdue[0]!.textContent).toContain('Wafer W01');
    // the two beyond the first six are one link away, not cut off without a word
    const more = [...root.querySelectorAll('a.more')];
    expect(more.map((a) => a.textContent?.trim())).toEqual([
      'All 250 overdue in the worklist',
      'All 40 recently finished in the worklist',
    ]);
    expect(more[0]!.getAttribute('href')).toBe('/worklist');
    expect(root.querySelectorAll('[aria-label="Open"] li')).toHaveLength(2);
    // the counts are the lab's, not those of a page: 252 open of which 250 overdue, 40 done
    const counts = [...root.querySelectorAll('.count')].map((c) =>
      c.textContent?.replace(/\s+/g, ' ').trim(),
    );
    expect(counts).toEqual(['252 open', '250 overdue', '40 finished']);
  });
});
