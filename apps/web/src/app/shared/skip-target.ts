import {
  DestroyRef,
  Directive,
  ElementRef,
  Injectable,
  afterNextRender,
  inject,
  input,
  signal,
} from '@angular/core';

/** A section of the current page a keyboard user can jump to from the top. */
export interface SkipPlace {
  /** What the link says after "Skip to". */
  words: string;
  element: HTMLElement;
}

/**
 * The page's sections, in page order, for the shell's skip links. Sections register themselves
 * with `rtSkipTarget` while they are on screen.
 */
@Injectable({ providedIn: 'root' })
export class SkipPlaces {
  private readonly all = signal<readonly SkipPlace[]>([]);
  readonly places = this.all.asReadonly();

  add(place: SkipPlace): void {
    this.all.update((list) => [...list, place].sort(inPageOrder));
  }

  remove(place: SkipPlace): void {
    this.all.update((list) => list.filter((p) => p !== place));
  }
}

function inPageOrder(a: SkipPlace, b: SkipPlace): number {
  return a.element.compareDocumentPosition(b.element) & Node.DOCUMENT_POSITION_FOLLOWING ? -1 : 1;
}

/**
 * Moves the keyboard to a place: the element itself when it takes focus (a button), else the
 * element made focusable for scripts only (a heading or a section), so the next Tab continues
 * from there. A disabled control hands over to its parent.
 */
export function focusPlace(element: HTMLElement): void {
  const target = (element as HTMLButtonElement).disabled ? element.parentElement : element;
  if (!target) return;
  if (target.tabIndex < 0) {
    // not a control: focusable by script only, and marked so the ring leaves it alone
    target.tabIndex = -1;
    target.dataset['rtPlace'] = '';
  }
  target.focus({ preventScroll: true });
  target.scrollIntoView({ block: 'start' });
}

/**
 * Marks a page section the skip links at the top of the page lead to:
 * `<h2 rtSkipTarget>Sweeps</h2>` (the words are the element's text) or
 * `<rt-saved-fits rtSkipTarget="Saved fits" />`.
 */
@Directive({ selector: '[rtSkipTarget]' })
export class SkipTarget {
  /** The words of the link; empty takes the element's own text. */
  readonly rtSkipTarget = input<string>('');

  constructor() {
    const element = inject<ElementRef<HTMLElement>>(ElementRef).nativeElement;
    const places = inject(SkipPlaces);
    const destroyRef = inject(DestroyRef);
    afterNextRender(() => {
      const words = this.rtSkipTarget() || (element.textContent ?? '').replace(/\s+/g, ' ').trim();
      const place = { words, element };
      places.add(place);
      destroyRef.onDestroy(() => places.remove(place));
    });
  }
}
