import { Clipboard } from '@angular/cdk/clipboard';
import {
  ChangeDetectionStrategy,
  Component,
  inject,
  input,
  signal,
  viewChild,
} from '@angular/core';
import { rxResource } from '@angular/core/rxjs-interop';
import {
  FormGroupDirective,
  NonNullableFormBuilder,
  ReactiveFormsModule,
  Validators,
} from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import type { StationDto, StationTokenCreatedResponse, StationTokenDto } from '@rhotrace/api-types';
import { filter, of, switchMap } from 'rxjs';
import { ApiError } from '../../../core/http/api-error';
import { Confirmer } from '../../../shared/confirm-dialog';
import { fieldError } from '../../../shared/field-error';
import { formatDay, formatStamp } from '../../../shared/format';
import { StationsApi } from '../stations-api';
import { RowCards } from '../../../shared/row-cards';

/**
 * The tokens a station's computer posts its sweeps with: make one (its secret shown once, to
 * copy), see when each was last used, revoke one at once.
 */
@Component({
  selector: 'rt-station-tokens',
  imports: [
    RowCards,
    ReactiveFormsModule,
    MatButtonModule,
    MatFormFieldModule,
    MatInputModule,
    MatSelectModule,
    MatTableModule,
  ],
  templateUrl: './station-tokens.html',
  styles: `
    .panel {
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 16px;
      padding: 4px 16px 12px;
    }
    .secret {
      background: var(--mat-sys-surface-container-high);
      border-radius: 8px;
      padding: 8px 12px;
      margin: 8px 0;
    }
    .secret code {
      font-size: 0.95em;
      word-break: break-all;
      user-select: all;
    }
    .danger {
      color: var(--mat-sys-error);
    }
    mat-form-field {
      width: 280px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class StationTokens {
  private readonly api = inject(StationsApi);
  private readonly confirmer = inject(Confirmer);
  private readonly clipboard = inject(Clipboard);
  private readonly fb = inject(NonNullableFormBuilder);
  private readonly formDirective = viewChild(FormGroupDirective);

  readonly stations = input.required<StationDto[]>();

  protected readonly error = fieldError;
  protected readonly day = formatDay;
  protected readonly stamp = formatStamp;
  protected readonly columns = ['label', 'prefix', 'created', 'lastUsed', 'state', 'revoke'];
  protected readonly stationId = signal<number | null>(null);
  protected readonly made = signal<StationTokenCreatedResponse | null>(null);
  protected readonly copied = signal(false);
  protected readonly problem = signal<string | null>(null);
  protected readonly tokens = rxResource({
    params: () => this.stationId(),
    stream: ({ params }) =>
      params === null ? of([] as StationTokenDto[]) : this.api.tokens(params),
  });
  protected readonly form = this.fb.group({
    label: ['', [Validators.required, Validators.maxLength(100)]],
  });

  protected choose(id: number): void {
    this.stationId.set(id);
    this.made.set(null);
    this.problem.set(null);
  }

  protected create(): void {
    const id = this.stationId();
    if (id === null || this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    this.problem.set(null);
    this.api.createToken(id, this.form.getRawValue().label).subscribe({
      next: (made) => {
        this.made.set(made);
        this.copied.set(false);
        // resetForm also clears the submitted state, so the empty field shows no error
        this.formDirective()?.resetForm();
        this.tokens.reload();
      },
      error: (err: unknown) => {
        this.problem.set(err instanceof ApiError ? err.message : 'The token was not made.');
      },
    });
  }

  protected copy(token: string): void {
    this.copied.set(this.clipboard.copy(token));
  }

  protected revoke(t: StationTokenDto): void {
    this.confirmer
      .ask({
        title: `Revoke the token “${t.label}”?`,
        message:
          'The station computer using it can post no more sweeps with it, from now on. ' +
          'Sweeps it posted stay, and so does the change trail.',
        confirmWords: 'Revoke the token',
      })
      .pipe(
        filter((yes) => yes),
        switchMap(() => this.api.revokeToken(t.stationId, t.id)),
      )
      .subscribe(() => this.tokens.reload());
  }
}
