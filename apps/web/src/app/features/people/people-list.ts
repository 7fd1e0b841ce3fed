import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatSlideToggleModule } from '@angular/material/slide-toggle';
import { MatTableModule } from '@angular/material/table';
import { MIN_PASSWORD_LENGTH, ROLES, type Role, type UserDto } from '@rhotrace/api-types';
import { fieldError } from '../../shared/field-error';
import { EditSession } from '../../shared/list-editor/edit-session';
import { ListEditor } from '../../shared/list-editor/list-editor';
import { PeopleApi } from './people-api';

/** Accounts and roles (admin). */
@Component({
  selector: 'rt-people-list',
  imports: [
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
      <table mat-table [dataSource]="people.value()?.items ?? []" aria-label="Accounts">
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
              (change)="setActive(u, $event.checked)"
              [aria-label]="'Account of ' + u.name + ' active'"
            /></td
        ></ng-container>
        <tr mat-header-row *matHeaderRowDef="columns"></tr>
        <tr mat-row *matRowDef="let row; columns: columns"></tr>
      </table>
    </rt-list-editor>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PeopleList {
  private readonly api = inject(PeopleApi);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly roles = ROLES;
  protected readonly minLength = MIN_PASSWORD_LENGTH;
  protected readonly error = fieldError;
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

  protected setActive(u: UserDto, active: boolean): void {
    this.api.update(u.id, { active }).subscribe(() => this.people.reload());
  }
}
