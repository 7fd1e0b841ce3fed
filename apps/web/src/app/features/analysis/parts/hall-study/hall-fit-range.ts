import { ChangeDetectionStrategy, Component, model } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

/** The temperature range a Hall fit uses, K; an empty bound fits from (or to) the sweep's end. */
@Component({
  selector: 'rt-hall-fit-range',
  imports: [FormsModule, MatFormFieldModule, MatInputModule],
  template: `
    <mat-form-field>
      <mat-label>From</mat-label>
      <input matInput type="number" step="any" [(ngModel)]="minK" />
      <span matTextSuffix>K</span>
    </mat-form-field>
    <mat-form-field>
      <mat-label>To</mat-label>
      <input matInput type="number" step="any" [(ngModel)]="maxK" />
      <span matTextSuffix>K</span>
    </mat-form-field>
  `,
  styles: `
    :host {
      display: contents;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class HallFitRange {
  readonly minK = model<number | null>(null);
  readonly maxK = model<number | null>(null);
}
