import { ChangeDetectionStrategy, Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatTableModule } from '@angular/material/table';
import { RovingToolbar } from './roving-toolbar';
import { RowCards } from './row-cards';

@Component({
  imports: [RovingToolbar],
  template: `<div role="toolbar" rtRovingToolbar>
    <button type="button">One</button>
    <button type="button" disabled>Two</button>
    <button type="button">Three</button>
  </div>`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class ToolbarHost {}

@Component({
  imports: [MatTableModule, RowCards],
  template: `<table mat-table rtRowCards [dataSource]="rows">
    <ng-container matColumnDef="name">
      <th mat-header-cell *matHeaderCellDef>Station</th>
      <td mat-cell *matCellDef="let r">{{ r }}</td>
    </ng-container>
    <ng-container matColumnDef="act">
      <th mat-header-cell *matHeaderCellDef><span class="cdk-visually-hidden">Edit</span></th>
      <td mat-cell *matCellDef="let r"><button type="button">Edit</button></td>
    </ng-container>
    <tr mat-header-row *matHeaderRowDef="columns"></tr>
    <tr mat-row *matRowDef="let row; columns: columns"></tr>
  </table>`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class TableHost {
  rows = ['North', 'South'];
  readonly columns = ['name', 'act'];
}

@Component({
  imports: [RowCards],
  template: `<table rtRowCards>
    <thead>
      <tr>
        <th>Fit</th>
        <th>R²</th>
        <th><span class="cdk-visually-hidden">Actions</span></th>
      </tr>
    </thead>
    <tbody>
      @for (r of rows; track r) {
        <tr>
          <td>{{ r }}</td>
          <td>0.99</td>
          <td><button type="button">Delete</button></td>
        </tr>
      }
    </tbody>
  </table>`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class PlainTableHost {
  rows = ['Arrhenius #1', 'Full model #2'];
}

const key = (target: Element, k: string) =>
  target.dispatchEvent(new KeyboardEvent('keydown', { key: k, bubbles: true }));

describe('RovingToolbar', () => {
  it('is one Tab stop; arrows, Home and End move past disabled buttons and wrap', async () => {
    const fixture = TestBed.createComponent(ToolbarHost);
    document.body.appendChild(fixture.nativeElement);
    await fixture.whenStable();
    const [one, two, three] = Array.from(
      (fixture.nativeElement as HTMLElement).querySelectorAll('button'),
    );
    expect([one!.tabIndex, two!.tabIndex, three!.tabIndex]).toEqual([0, -1, -1]);

    one!.focus();
    key(one!, 'ArrowRight');
    expect(document.activeElement).toBe(three);
    expect([one!.tabIndex, three!.tabIndex]).toEqual([-1, 0]);
    key(three!, 'ArrowRight');
    expect(document.activeElement).toBe(one);
    key(one!, 'End');
    expect(document.activeElement).toBe(three);
    key(three!, 'Home');
    expect(document.activeElement).toBe(one);
    fixture.nativeElement.remove();
  });
});

describe('RowCards', () => {
  it("labels each cell with its column's visible heading; action cells get an empty label", async () => {
    const fixture = TestBed.createComponent(TableHost);
    await fixture.whenStable();
    const cells = Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('tbody td'));
    expect(cells.map((c) => (c as HTMLElement).dataset['label'])).toEqual([
      'Station',
      '',
      'Station',
      '',
    ]);
  });

  it('labels the cells of a plain table by their position under the headings', async () => {
    const fixture = TestBed.createComponent(PlainTableHost);
    await fixture.whenStable();
    const cells = Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('tbody td'));
    expect(cells.map((c) => (c as HTMLElement).dataset['label'])).toEqual([
      'Fit',
      'R²',
      '',
      'Fit',
      'R²',
      '',
    ]);
    expect((fixture.nativeElement as HTMLElement).querySelector('table')!.className).toContain(
      'rt-row-cards',
    );
  });
});
