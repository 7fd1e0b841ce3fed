import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatDialog } from '@angular/material/dialog';
import { MatSlideToggle, MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatTableModule } from '@angular/material/table';
import {
  MIN_PASSWORD_LENGTH,
  ROLES,
  type Role,
  type UpdateUserRequest,
  type UserDto,
} from '@rhotrace/api-types';
import { forkJoin, map, switchMap } from 'rxjs';
import { Session } from '../../core/auth/session';
import { fieldError } from '../../shared/field-error';
import { EditSession } from '../../shared/list-editor/edit-session';
import { ListEditor } from '../../shared/list-editor/list-editor';
import {
  DeactivateDialog,
  type DeactivateAnswer,
  type DeactivateQuestion,
} from './deactivate-dialog';
import { PeopleApi } from './people-api';
import { RowCards } from '../../shared/row-cards';

/** Accounts and roles (admin). */
@Component({
  selector: 'rt-people-list',
  imports: [
    RowCards,
    MatTableModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatSlideToggleModule,
    ReactiveFormsModule,
    ListEditor,
  ],
  template: `
    <rt-list-editor
      heading="People"
      addLabel="Add a person"
      [open]="session.editing() !== null"
      [problem]="session.problem()"
      (add)="session.start('new')"
    >
      <form
        rtEditorForm
        [formGroup]="form"
        (ngSubmit)="create()"
        novalidate
        aria-label="New account"
      >
        <div class="rt-grid">
          <mat-form-field
            ><mat-label>Name</mat-label><input matInput formControlName="name" required />
            <mat-error>{{ error(form.controls.name) }}</mat-error></mat-form-field
          >
          <mat-form-field
            ><mat-label>E-mail</mat-label
            ><input matInput type="email" formControlName="email" required />
            <mat-error>{{ error(form.controls.email) }}</mat-error></mat-form-field
          >
          <mat-form-field
            ><mat-label>Role</mat-label>
            <mat-select formControlName="role">
              @for (r of roles; track r) {
                <mat-option [value]="r">{{ r }}</mat-option>
              }
            </mat-select></mat-form-field
          >
          <mat-form-field
            ><mat-label>First password</mat-label
            ><input
              matInput
              type="password"
              formControlName="password"
              autocomplete="new-password"
              required
            />
            <mat-hint>At least {{ minLength }} characters; they can change it by e-mail.</mat-hint>
            <mat-error>{{ error(form.controls.password) }}</mat-error></mat-form-field
          >
        </div>
        <div class="rt-row">
          <button mat-flat-button type="submit">Create the account</button>
          <button mat-button type="button" (click)="session.close()">Cancel</button>
        </div>
      </form>
      <table mat-table rtRowCards [dataSource]="people.value()?.items ?? []" aria-label="Accounts">
        <ng-container matColumnDef="name"
          ><th mat-header-cell *matHeaderCellDef>Name</th>
          <td mat-cell *matCellDef="let u">{{ u.name }}</td></ng-container
        >
        <ng-container matColumnDef="email"
          ><th mat-header-cell *matHeaderCellDef>E-mail</th>
          <td mat-cell *matCellDef="let u">{{ u.email }}</td></ng-container
        >
        <ng-container matColumnDef="role"
          ><th mat-header-cell *matHeaderCellDef>Role</th>
          <td mat-cell *matCellDef="let u">
            <mat-form-field subscriptSizing="dynamic"
              ><mat-label>Role</mat-label>
              <mat-select [value]="u.role" (valueChange)="setRole(u, $event)">
                @for (r of roles; track r) {
                  <mat-option [value]="r">{{ r }}</mat-option>
                }
              </mat-select>
            </mat-form-field>
          </td></ng-container
        >
        <ng-container matColumnDef="active"
          ><th mat-header-cell *matHeaderCellDef>Active</th>
          <td mat-cell *matCellDef="let u">
            <mat-slide-toggle
              [checked]="u.active"
              [disabled]="u.id === myId() || busyId() === u.id"
              (change)="setActive(u, $event.checked, $event.source)"
              [aria-label]="'Account of ' + u.name + ' active'"
            />
            @if (u.id === myId()) {
              <span class="rt-muted own">your own account</span>
            }
          </td></ng-container
        >
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
      </table>
    </rt-list-editor>
  `,
  styles: `
    .own {
      margin-left: 8px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PeopleList {
  private readonly api = inject(PeopleApi);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly roles = ROLES;
  protected readonly minLength = MIN_PASSWORD_LENGTH;
  protected readonly error = fieldError;
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly signedIn = inject(Session);
  protected readonly myId = computed(() => this.signedIn.user()?.id ?? null);
  /** The account whose deactivation question is being prepared. */
  protected readonly busyId = signal<number | null>(null);
  protected readonly columns = ['name', 'email', 'role', 'active'];
  protected readonly people = rxResource({
    stream: () => this.api.list({ pageSize: 200, sort: 'name' }),
  });
  protected readonly form = this.fb.group({
    name: ['', [Validators.required, Validators.maxLength(200)]],
    email: ['', [Validators.required, Validators.email]],
    role: this.fb.control<Role>('technician'),
    password: ['', [Validators.required, Validators.minLength(MIN_PASSWORD_LENGTH)]],
  });
  /** Accounts are only added here; role and active are changed in the table. */
  protected readonly session = new EditSession<never>(this.form);

  protected create(): void {
    this.session.submit(
      () => this.api.create(this.form.getRawValue()),
      () => {
        this.form.reset();
        this.people.reload();
      },
      (err) => {
        if (err.status === 409)
          this.form.controls.email.setErrors({ server: 'already has an account' });
      },
    );
  }

  protected setRole(u: UserDto, role: Role): void {
    this.api.update(u.id, { role }).subscribe(() => this.people.reload());
  }

  /**
   * Reactivates at once; deactivation first asks, naming the open tasks and offering to hand
   * them over in the same request. The switch goes back when the question is declined.
   */
  protected setActive(u: UserDto, active: boolean, toggle: MatSlideToggle): void {
    if (active) {
      this.save(u, { active: true }, `${u.name} can sign in again.`);
      return;
    }
    this.busyId.set(u.id);
    forkJoin([this.api.openTasks(u.id), this.api.assignees()])
      .pipe(
        switchMap(([openTasks, candidates]) =>
          this.dialog
            .open<DeactivateDialog, DeactivateQuestion, DeactivateAnswer>(DeactivateDialog, {
              data: { person: u, openTasks, candidates },
              width: '520px',
            })
            .afterClosed()
            .pipe(map((answer) => ({ answer, openTasks, candidates }))),
        ),
      )
      .subscribe({
        next: ({ answer, openTasks, candidates }) => {
          this.busyId.set(null);
          if (!answer) {
            toggle.checked = true;
            return;
          }
          const to = candidates.find((c) => c.id === answer.reassignTo);
          const tasks = `${openTasks.length} open ${openTasks.length === 1 ? 'task' : 'tasks'}`;
          const outcome =
            openTasks.length === 0
              ? ''
              : to
                ? ` ${tasks} now with ${to.name}.`
                : ` ${tasks} stay with them.`;
          this.save(
            u,
            { active: false, ...(to ? { reassignTo: to.id } : {}) },
            `${u.name} is deactivated.${outcome}`,
            toggle,
          );
        },
        error: () => {
          this.busyId.set(null);
          toggle.checked = true;
          this.snackBar.open(`The open tasks of ${u.name} could not be loaded.`, 'OK');
        },
      });
  }

  private save(u: UserDto, body: UpdateUserRequest, done: string, toggle?: MatSlideToggle): void {
    this.api.update(u.id, body).subscribe({
      next: () => {
        this.snackBar.open(done, 'OK', { duration: 6000 });
        this.people.reload();
      },
      error: (err: { error?: { error?: { message?: string } } }) => {
        if (toggle) toggle.checked = !toggle.checked;
        this.snackBar.open(err.error?.error?.message ?? 'The change was not saved.', 'OK');
        this.people.reload();
      },
    });
  }
}
