import { DestroyRef, Directive, ElementRef, afterNextRender, inject } from '@angular/core';

/** The class mat-table gives every cell of a column: `mat-column-<name>`. */
const COLUMN_CLASS = /^mat-column-/;

/**
 * Lets a list table turn into one card per row on a narrow screen (the `rt-row-cards` styles in
 * styles.scss, below 600 px), so a row's actions stay on screen instead of past a sideways
 * scroll. The directive writes each body cell's column heading into its `data-label`, which the
 * card shows before the value; a column whose heading is only for screen readers (row actions)
 * gets an empty label and its controls take the card's whole width.
 *
 * Used on every list table with something to do per row: `<table mat-table rtRowCards …>`.
 */
@Directive({
  selector: 'table[rtRowCards]',
  host: { class: 'rt-row-cards' },
})
export class RowCards {
  private readonly table = inject<ElementRef<HTMLTableElement>>(ElementRef).nativeElement;

  constructor() {
    const destroyRef = inject(DestroyRef);
    afterNextRender(() => {
      this.labelCells();
      // Rows come and go with the data source; label the new ones as they arrive.
      const observer = new MutationObserver(() => this.labelCells());
      observer.observe(this.table, { childList: true, subtree: true });
      destroyRef.onDestroy(() => observer.disconnect());
    });
  }

  private labelCells(): void {
    const labels = new Map<string, string>();
    for (const th of Array.from(this.table.querySelectorAll<HTMLElement>('thead th'))) {
      const column = columnOf(th);
      if (column) labels.set(column, headingWords(th));
    }
    for (const td of Array.from(this.table.querySelectorAll<HTMLElement>('tbody td'))) {
      const column = columnOf(td);
      const label = column === null ? undefined : labels.get(column);
      if (label !== undefined && td.dataset['label'] !== label) td.dataset['label'] = label;
    }
  }
}

function columnOf(cell: HTMLElement): string | null {
  return Array.from(cell.classList).find((c) => COLUMN_CLASS.test(c)) ?? null;
}

/** A heading's visible words; a heading kept for screen readers only labels nothing. */
function headingWords(th: HTMLElement): string {
  const copy = th.cloneNode(true) as HTMLElement;
  for (const hidden of Array.from(copy.querySelectorAll('.cdk-visually-hidden'))) hidden.remove();
  // the sort arrow of a sortable heading carries no words
  return (copy.textContent ?? '').replace(/\s+/g, ' ').trim();
}
