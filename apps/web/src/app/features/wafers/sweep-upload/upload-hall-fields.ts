import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { HallFactorName } from '@rhotrace/api-types';
import { HALL_SCATTERING_FACTORS } from '@rhotrace/physics';
import type { UploadItem } from './upload-item';
import { UploadStore } from './upload-store';

/** The named Hall factors the API takes, with their values from the physics library. */
export const HALL_FACTOR_CHOICES: ReadonlyArray<{
  name: HallFactorName;
  value: number;
  words: string;
}> = [
  {
    name: 'degenerate',
    value: HALL_SCATTERING_FACTORS.degenerate,
    words: 'Degenerate or strong field',
  },
  {
    name: 'acoustic-phonon',
    value: HALL_SCATTERING_FACTORS.acousticPhonon,
    words: 'Acoustic phonons, 3π/8',
  },
  {
    name: 'ionized-impurity',
    value: HALL_SCATTERING_FACTORS.ionizedImpurity,
    words: 'Ionized impurities, 315π/512',
  },
];

/** The range of a Hall factor given as a number, as the API checks it. */
export const HALL_FACTOR_RANGE = { min: 0.5, max: 3 } as const;

/** A typed Hall factor: the number when it is within `HALL_FACTOR_RANGE`, else null. */
export function typedHallFactor(raw: string): number | null {
  const value = raw.trim() === '' ? Number.NaN : Number(raw);
  return Number.isFinite(value) && value >= HALL_FACTOR_RANGE.min && value <= HALL_FACTOR_RANGE.max
    ? value
    : null;
}

/**
 * A Hall file's scattering factor r_H (shown for the hall method only): a named factor or a
 * number, with the assumption it stands for; each change checks the file again.
 */
@Component({
  selector: 'rt-upload-hall-fields',
  imports: [MatFormFieldModule, MatInputModule, MatSelectModule],
  template: `
    @if (item().choices.method === 'hall') {
      <div class="settings" role="group" [attr.aria-label]="'Hall factor of ' + item().file.name">
        <mat-form-field class="factor">
          <mat-label>Hall factor r_H</mat-label>
          <mat-select [value]="chosen()" (valueChange)="choose($event)">
            @for (c of choices; track c.name) {
              <mat-option [value]="c.name">{{ c.words }} ({{ c.value.toFixed(3) }})</mat-option>
            }
            <mat-option value="number">Another value</mat-option>
          </mat-select>
        </mat-form-field>
        @if (chosen() === 'number') {
          <mat-form-field class="geo">
            <mat-label>r_H</mat-label>
            <input
              matInput
              type="number"
              step="any"
              [min]="range.min"
              [max]="range.max"
              [value]="typed()"
              (change)="type($any($event.target).value)"
            />
            <mat-hint>{{ range.min }} to {{ range.max }}</mat-hint>
          </mat-form-field>
          @if (outOfRange()) {
            <p class="problem" role="alert">
              r_H must be a number from {{ range.min }} to {{ range.max }}; the file is checked with
              1 until one is typed.
            </p>
          }
        }
      </div>
      <p class="rt-muted small">
        Densities are n = r_H / (q |R_H|), with r_H set by how the carriers scatter: 1 for a
        degenerate sample or a strong field (used when none is chosen), 3π/8 when acoustic phonons
        dominate, 315π/512 for ionized impurities (non-degenerate carriers, one parabolic band;
        Blakemore 1962, Look 1989). The Hall mobility |R_H|/ρ does not depend on it.
      </p>
    }
  `,
  styleUrl: './sweep-upload.scss',
  styles: `
    .factor {
      width: 300px;
    }
    .problem {
      color: var(--mat-sys-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UploadHallFields {
  private readonly store = inject(UploadStore);

  readonly item = input.required<UploadItem>();

  protected readonly choices = HALL_FACTOR_CHOICES;
  protected readonly range = HALL_FACTOR_RANGE;
  /** "Another value" picked, before a number in range is typed. */
  private readonly wantsNumber = signal(false);
  protected readonly outOfRange = signal(false);
  protected readonly chosen = computed<HallFactorName | 'number'>(() => {
    const factor = this.item().choices.hallFactor;
    if (typeof factor === 'number' || this.wantsNumber()) return 'number';
    return factor ?? 'degenerate';
  });
  protected readonly typed = computed(() => {
    const factor = this.item().choices.hallFactor;
    return typeof factor === 'number' ? String(factor) : '';
  });

  protected choose(choice: HallFactorName | 'number'): void {
    this.wantsNumber.set(choice === 'number');
    this.outOfRange.set(false);
    if (choice !== 'number') this.store.choose(this.item().key, { hallFactor: choice });
  }

  protected type(raw: string): void {
    const value = typedHallFactor(raw);
    this.outOfRange.set(value === null);
    this.store.choose(this.item().key, { hallFactor: value ?? undefined });
  }
}
