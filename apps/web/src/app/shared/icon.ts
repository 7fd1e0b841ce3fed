import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';

/** Rhotrace's small line icons, drawn for the app (no icon font, nothing fetched). */
const PATHS = {
  menu: 'M4 7h16M4 12h16M4 17h16',
  contrast: 'M12 3a9 9 0 1 0 0 18zM12 3a9 9 0 0 1 0 18',
  leave: 'M14 5h5v14h-5M10 8l-4 4 4 4M6 12h10',
  upload: 'M12 16V4M7 9l5-5 5 5M4 20h16',
  warn: 'M12 3l10 18H2zM12 10v5M12 18v.5',
  close: 'M6 6l12 12M18 6L6 18',
  add: 'M12 5v14M5 12h14',
  chart: 'M4 20V4M4 20h16M7 15l4-5 3 3 5-7',
} as const;

export type IconName = keyof typeof PATHS;

@Component({
  selector: 'rt-icon',
  template: `<svg viewBox="0 0 24 24" width="22" height="22" aria-hidden="true" focusable="false">
    <path
      [attr.d]="path()"
      fill="none"
      stroke="currentColor"
      stroke-width="1.8"
      stroke-linecap="round"
      stroke-linejoin="round"
    />
  </svg>`,
  styles: ':host { display: inline-flex; line-height: 0; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Icon {
  readonly name = input.required<IconName>();
  protected readonly path = computed(() => PATHS[this.name()]);
}
