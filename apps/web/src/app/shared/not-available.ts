import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { RouterLink } from '@angular/router';

/**
 * One clear page for a record or screen the signed-in person may not open (or that no longer
 * exists: the API answers both alike, so existence does not leak), with a way back.
 */
@Component({
  selector: 'rt-not-available',
  imports: [RouterLink],
  template: `
    <section class="not-available" role="alert" aria-labelledby="not-available-title">
      <h1 id="not-available-title" class="rt-page-title">Not available to you</h1>
      <p>
        {{ what() }} is not among the records your role may open, or it no longer exists. If you
        expected to see it, ask whoever assigns your work.
      </p>
      <p><a routerLink="/">Back to your bench</a></p>
    </section>
  `,
  styles: `
    .not-available {
      max-width: 40rem;
      padding: 24px 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotAvailable {
  /** What was asked for, as the start of a sentence ("This wafer", "This page"). */
  readonly what = input('This page');
}
