import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { SPEC_VERDICT_MEANINGS, SPEC_VERDICT_WORDS, type SpecVerdict } from '@rhotrace/api-types';

/** A guard-banded spec verdict in Rhotrace's words, with what it means on hover. */
@Component({
  selector: 'rt-spec-verdict',
  template: `@if (verdict(); as v) {
      <span class="verdict" [class]="v" [attr.title]="meaning()">{{ words() }}</span>
    } @else {
      <span class="none">{{ fallback() }}</span>
    }`,
  styles: `
    .verdict {
      display: inline-block;
      padding: 0 8px;
      border-radius: 10px;
      border: 1px solid currentColor;
      font: var(--mat-sys-label-medium);
      white-space: nowrap;
    }
    .pass {
      color: #00704f;
    }
    .fail {
      color: var(--mat-sys-error);
      font-weight: 600;
    }
    .indeterminate {
      /* #8a4600 on the caution background is 6.4:1 (WCAG 2.2 AA asks 4.5:1 for this size). */
      color: #8a4600;
      background: var(--rt-caution-bg);
      border-style: dashed;
    }
    :host-context(html.rt-dark) .indeterminate {
      color: var(--rt-caution-border);
    }
    :host-context(html.rt-dark) .pass {
      color: #5fd3a8;
    }
    .none {
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SpecVerdictBadge {
  readonly verdict = input<SpecVerdict | null | undefined>(null);
  /** Shown when there is no verdict (e.g. the reason). */
  readonly fallback = input('no verdict');
  protected readonly words = computed(() => {
    const v = this.verdict();
    return v ? SPEC_VERDICT_WORDS[v] : '';
  });
  protected readonly meaning = computed(() => {
    const v = this.verdict();
    return v ? SPEC_VERDICT_MEANINGS[v] : null;
  });
}
