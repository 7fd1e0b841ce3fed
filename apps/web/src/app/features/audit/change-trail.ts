import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import { DEFAULT_PAGE_SIZE } from '@rhotrace/api-types';
import { formatStamp } from '../../shared/format';
import { ChangeList } from '../../shared/record-history/change-list';
import { AuditApi } from './audit-api';

const ENTITIES = ['lot', 'wafer', 'station', 'assignment', 'user', 'sweep', 'fit'] as const;

/** Who changed what and when, with the values before and after. */
@Component({
  selector: 'rt-change-trail',
  imports: [
    MatTableModule,
    MatPaginatorModule,
    MatSelectModule,
    MatFormFieldModule,
    MatInputModule,
    ChangeList,
  ],
  template: `
    <div class="rt-page">
      <h1 class="rt-page-title">Change trail</h1>
      <div class="rt-row">
        <mat-form-field
          ><mat-label>Record kind</mat-label>
          <mat-select [value]="entity()" (valueChange)="entity.set($event); pageIndex.set(0)">
            <mat-option value="">Every kind</mat-option>
            @for (e of entities; track e) {
              <mat-option [value]="e">{{ e }}</mat-option>
            }
          </mat-select></mat-form-field
        >
        <mat-form-field
          ><mat-label>Record id</mat-label>
          <input
            matInput
            [value]="recordId()"
            (change)="recordId.set($any($event.target).value); pageIndex.set(0)"
        /></mat-form-field>
      </div>
      <div class="rt-table-wrap">
        <table mat-table [dataSource]="events.value()?.items ?? []" aria-label="Change events">
          <ng-container matColumnDef="when"
            ><th mat-header-cell *matHeaderCellDef>When</th>
            <td mat-cell *matCellDef="let e">
              {{ stamp(e.createdAt) }}
            </td></ng-container
          >
          <ng-container matColumnDef="change"
            ><th mat-header-cell *matHeaderCellDef>Who changed what</th>
            <td mat-cell *matCellDef="let e"><rt-change-list [event]="e" /></td
          ></ng-container>
          <tr mat-header-row *matHeaderRowDef="columns"></tr>
          <tr mat-row *matRowDef="let row; columns: columns"></tr>
        </table>
        <mat-paginator
          [length]="events.value()?.total ?? 0"
          [pageIndex]="pageIndex()"
          [pageSize]="pageSize()"
          [pageSizeOptions]="[25, 50, 100]"
          (page)="setPage($event)"
          aria-label="Pages of the change trail"
        />
      </div>
    </div>
  `,
  styles: `
    table {
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChangeTrail {
  private readonly api = inject(AuditApi);
  protected readonly entities = ENTITIES;
  protected readonly stamp = formatStamp;
  protected readonly columns = ['when', 'change'];
  protected readonly entity = signal('');
  protected readonly recordId = signal('');
  protected readonly pageIndex = signal(0);
  protected readonly pageSize = signal(DEFAULT_PAGE_SIZE);
  protected readonly events = rxResource({
    params: () => ({
      entity: this.entity(),
      id: this.recordId(),
      page: this.pageIndex() + 1,
      pageSize: this.pageSize(),
    }),
    stream: ({ params }) => this.api.list(params),
  });

  protected setPage(e: PageEvent): void {
    this.pageIndex.set(e.pageIndex);
    this.pageSize.set(e.pageSize);
  }
}
