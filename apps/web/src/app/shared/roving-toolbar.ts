import { Directive, ElementRef, afterNextRender, inject } from '@angular/core';

/** Keys that move between a toolbar's buttons, and where each goes. */
const MOVES: Record<string, (index: number, count: number) => number> = {
  ArrowRight: (i, n) => (i + 1) % n,
  ArrowDown: (i, n) => (i + 1) % n,
  ArrowLeft: (i, n) => (i - 1 + n) % n,
  ArrowUp: (i, n) => (i - 1 + n) % n,
  Home: () => 0,
  End: (_i, n) => n - 1,
};

/**
 * A toolbar that is one stop of the Tab key: Tab reaches its current button, the arrow keys,
 * Home and End move between its buttons, Tab again leaves it (the toolbar pattern with a roving
 * tabindex, WAI-ARIA Authoring Practices 1.2, "Toolbar"). The button last used stays the one
 * Tab comes back to. Put it on an element with `role="toolbar"` holding plain buttons.
 */
@Directive({
  selector: '[rtRovingToolbar]',
  host: { '(keydown)': 'move($event)', '(focusin)': 'remember($event)' },
})
export class RovingToolbar {
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef).nativeElement;

  constructor() {
    afterNextRender(() => this.makeCurrent(this.buttons()[0]));
  }

  protected move(event: KeyboardEvent): void {
    const step = MOVES[event.key];
    const usable = this.buttons().filter((b) => !b.disabled);
    const index = usable.indexOf(event.target as HTMLButtonElement);
    if (!step || index < 0) return;
    event.preventDefault();
    const next = usable[step(index, usable.length)];
    this.makeCurrent(next);
    next?.focus();
  }

  protected remember(event: FocusEvent): void {
    const button = event.target as HTMLButtonElement;
    if (this.buttons().includes(button)) this.makeCurrent(button);
  }

  private buttons(): HTMLButtonElement[] {
    return Array.from(this.host.querySelectorAll('button'));
  }

  private makeCurrent(current: HTMLButtonElement | undefined): void {
    for (const button of this.buttons()) button.tabIndex = button === current ? 0 : -1;
  }
}
