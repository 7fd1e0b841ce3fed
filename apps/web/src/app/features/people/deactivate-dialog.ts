import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import type { AssigneeDto, AssignmentDto, UserDto } from '@rhotrace/api-types';

/** What the deactivation dialog shows: the person, their open tasks and who could take them. */
export interface DeactivateQuestion {
  person: UserDto;
  openTasks: AssignmentDto[];
  candidates: AssigneeDto[];
}

/** The answer: deactivate, handing the open tasks to `reassignTo` (or leaving them, null). */
export interface DeactivateAnswer {
  reassignTo: number | null;
}

/** Confirms a deactivation, naming the person's open tasks and offering to hand them over. */
@Component({
  selector: 'rt-deactivate-dialog',
  imports: [MatDialogModule, MatButtonModule, MatFormFieldModule, MatSelectModule],
  template: `
    <h2 mat-dialog-title>Deactivate {{ q.person.name }}?</h2>
    <mat-dialog-content>
      <p>
        {{ q.person.name }} will no longer be able to sign in; their sessions end now. Their records
        and the change trail stay.
      </p>
      @if (q.openTasks.length === 0) {
        <p>They have no open tasks.</p>
      } @else {
        <p>
          They have {{ q.openTasks.length }} open {{ q.openTasks.length === 1 ? 'task' : 'tasks' }}:
        </p>
        <ul class="tasks">
          @for (t of q.openTasks; track t.id) {
            <li>
              Wafer {{ t.waferNumber ?? t.waferId }}{{ t.lotCode ? ' of lot ' + t.lotCode : '' }}:
              {{ t.task }}, due {{ t.dueDate }}
              @if (t.overdue) {
                <strong>(overdue)</strong>
              }
            </li>
          }
        </ul>
        <mat-form-field class="who">
          <mat-label>Hand the open tasks to</mat-label>
          <mat-select [value]="reassignTo()" (valueChange)="reassignTo.set($event)">
            @for (c of others; track c.id) {
              <mat-option [value]="c.id">{{ c.name }} ({{ c.role }})</mat-option>
            }
            <mat-option [value]="null">Nobody: leave them with {{ q.person.name }}</mat-option>
          </mat-select>
        </mat-form-field>
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="undefined">Keep the account</button>
      <button
        mat-flat-button
        class="danger"
        type="button"
        [mat-dialog-close]="{ reassignTo: q.openTasks.length ? reassignTo() : null }"
      >
        Deactivate {{ q.person.name }}
      </button>
    </mat-dialog-actions>
  `,
  styles: `
    .tasks {
      margin: 0 0 12px;
      padding-left: 20px;
    }
    .who {
      width: 100%;
    }
    .danger {
      --mat-button-filled-container-color: var(--mat-sys-error);
      --mat-button-filled-label-text-color: var(--mat-sys-on-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DeactivateDialog {
  protected readonly q = inject<DeactivateQuestion>(MAT_DIALOG_DATA);
  /** Everyone else who is active; a technician's tasks go first to another technician. */
  protected readonly others = this.q.candidates
    .filter((c) => c.id !== this.q.person.id)
    .sort((a, b) => Number(b.role === this.q.person.role) - Number(a.role === this.q.person.role));
  protected readonly reassignTo = signal<number | null>(this.others[0]?.id ?? null);
}
