import { DOCUMENT } from '@angular/common';
import { Injectable, effect, inject, signal } from '@angular/core';

const KEY = 'rhotrace.theme';

/** Light or dark scheme; follows the system until the user picks one. */
@Injectable({ providedIn: 'root' })
export class ThemeMode {
  private readonly doc = inject(DOCUMENT);
  readonly dark = signal(this.initial());

  constructor() {
    effect(() => this.doc.documentElement.classList.toggle('rt-dark', this.dark()));
  }

  toggle(): void {
    this.dark.update((d) => !d);
    globalThis.localStorage?.setItem(KEY, this.dark() ? 'dark' : 'light');
  }

  private initial(): boolean {
    const stored = globalThis.localStorage?.getItem(KEY);
    if (stored) return stored === 'dark';
    return globalThis.matchMedia?.('(prefers-color-scheme: dark)').matches ?? false;
  }
}
