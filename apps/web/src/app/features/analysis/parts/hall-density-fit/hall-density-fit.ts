import {
  ChangeDetectionStrategy,
  Component,
  computed,
  effect,
  inject,
  input,
  signal,
  untracked,
} from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import type { HallAnalysis } from '@rhotrace/api-types';
import { DOPANTS } from '@rhotrace/physics';
import { formatExponent, parseExponent } from '../../../../shared/engineering';
import { type HallDoping, isSemiconductor } from '../hall-study/hall-models';
import { HallFitRange } from '../hall-study/hall-fit-range';
import { HallFitResult } from '../hall-study/hall-fit-result';
import { HallFitsStore } from '../hall-study/hall-fits-store';

type Free = 'donorDensity' | 'acceptorDensity' | 'donorLevel' | 'acceptorLevel';

/** A starting doping from the sweep itself: the majority near its 300 K density, 5 % compensated. */
export function startingHallDoping(material: string, hall: HallAnalysis): HallDoping {
  const plateau =
    hall.carrierDensityAt300KCm3 ?? hall.steps[hall.steps.length - 1]?.carrierDensityCm3 ?? 1e15;
  const table = isSemiconductor(material) ? DOPANTS[material] : DOPANTS.Si;
  const majority = Number((1.1 * plateau).toPrecision(2));
  const minority = Number((0.05 * majority).toPrecision(2));
  const p = hall.carrierType === 'p';
  return {
    donorDensity: p ? minority : majority,
    acceptorDensity: p ? majority : minority,
    donorLevel: table.donors[table.defaultDonor]!,
    acceptorLevel: table.acceptors[table.defaultAcceptor]!,
  };
}

/**
 * The carrier-density fit of a Hall sweep: charge neutrality fitted to ln n(T). The doping typed
 * here is drawn on the n(T) plot until a fit replaces it; Keep saves the previewed fit.
 */
@Component({
  selector: 'rt-hall-density-fit',
  imports: [
    FormsModule,
    MatButtonModule,
    MatCheckboxModule,
    MatFormFieldModule,
    MatInputModule,
    HallFitRange,
    HallFitResult,
  ],
  template: `
    <section class="panel" aria-labelledby="hall-density-title">
      <h2 id="hall-density-title" class="rt-section-title">
        Carrier density fit (charge neutrality)
      </h2>
      <div class="rt-row fields">
        <mat-form-field>
          <mat-label>Donors N_D</mat-label>
          <input
            matInput
            inputmode="decimal"
            [value]="asExponent(doping()?.donorDensity)"
            (change)="set('donorDensity', readExponent($any($event.target).value))"
          />
          <span matTextSuffix>cm⁻³</span>
        </mat-form-field>
        <mat-form-field>
          <mat-label>Acceptors N_A</mat-label>
          <input
            matInput
            inputmode="decimal"
            [value]="asExponent(doping()?.acceptorDensity)"
            (change)="set('acceptorDensity', readExponent($any($event.target).value))"
          />
          <span matTextSuffix>cm⁻³</span>
        </mat-form-field>
        <mat-form-field>
          <mat-label>{{ nType() ? 'Donor level E_d' : 'Acceptor level E_a' }}</mat-label>
          <input
            matInput
            type="number"
            step="any"
            [ngModel]="level()"
            (ngModelChange)="set(levelKey(), $event)"
          />
          <span matTextSuffix>eV</span>
        </mat-form-field>
        <rt-hall-fit-range [(minK)]="minK" [(maxK)]="maxK" />
      </div>
      <div class="rt-row">
        @for (f of freeChoices(); track f.key) {
          <mat-checkbox [checked]="free().includes(f.key)" (change)="toggle(f.key, $event.checked)">
            Fit {{ f.words }}
          </mat-checkbox>
        }
        <span class="rt-spacer"></span>
        <button
          mat-flat-button
          type="button"
          (click)="run()"
          [disabled]="slot().busy || free().length === 0"
        >
          Fit n(T)
        </button>
      </div>
      <p class="rt-muted">
        Empty bounds fit the whole sweep; the level is fixed mostly by the frozen-out steps
        @if (hall().freezeOutWindow; as w) {
          (here {{ w.minK.toFixed(0) }}–{{ w.maxK.toFixed(0) }} K)
        }
        .
      </p>
      <rt-hall-fit-result kind="carrier-density" what="Fitting n(T)" />
    </section>
  `,
  styleUrl: '../../study-panel.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HallDensityFit {
  protected readonly store = inject(HallFitsStore);
  readonly material = input.required<string>();
  readonly hall = input.required<HallAnalysis>();

  protected readonly slot = this.store.slots['carrier-density'];
  protected readonly doping = this.store.enteredDoping;
  protected readonly minK = signal<number | null>(null);
  protected readonly maxK = signal<number | null>(null);
  protected readonly nType = computed(() => this.hall().carrierType !== 'p');
  protected readonly levelKey = computed<Free>(() =>
    this.nType() ? 'donorLevel' : 'acceptorLevel',
  );
  protected readonly level = computed(() => this.doping()?.[this.levelKey()] ?? null);
  protected readonly freeChoices = computed<Array<{ key: Free; words: string }>>(() => [
    { key: 'donorDensity', words: 'N_D' },
    { key: 'acceptorDensity', words: 'N_A' },
    { key: this.levelKey(), words: this.nType() ? 'E_d' : 'E_a' },
  ]);
  protected readonly free = signal<Free[]>([]);

  constructor() {
    effect(() => {
      const start = startingHallDoping(this.material(), this.hall());
      const nType = this.nType();
      untracked(() => {
        this.store.enteredDoping.set(start);
        this.free.set(['donorDensity', 'acceptorDensity', nType ? 'donorLevel' : 'acceptorLevel']);
      });
    });
  }

  /** Densities read and written as a lab notebook writes them (`9.94e14`). */
  protected readonly asExponent = formatExponent;
  protected readonly readExponent = parseExponent;

  protected set(key: Free, value: number | null): void {
    const d = this.doping();
    if (!d || value === null || !Number.isFinite(value)) return;
    this.store.enteredDoping.set({ ...d, [key]: value });
  }

  protected toggle(key: Free, on: boolean): void {
    this.free.update((list) => (on ? [...list, key] : list.filter((k) => k !== key)));
  }

  protected run(): void {
    const d = this.doping();
    if (!d) return;
    const minK = this.minK();
    const maxK = this.maxK();
    this.store.preview('carrier-density', {
      kind: 'carrier-density',
      material: this.material(),
      initial: d,
      free: this.free(),
      ...(minK ? { minK } : {}),
      ...(maxK ? { maxK } : {}),
    });
  }
}
