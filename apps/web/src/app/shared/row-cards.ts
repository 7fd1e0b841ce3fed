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
 * Used on every list table with something to do per row: `<table mat-table rtRowCards …>`, or
 * a plain `<table rtRowCards>` with thead and tbody (its cells labelled by position).
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
    // A mat-table names each cell's column by class; a plain table by the cell's position.
    const headings = Array.from(this.table.querySelectorAll<HTMLElement>('thead th'));
    const byColumn = new Map<string, string>();
    for (const th of headings) {
      const column = columnOf(th);
      if (column) byColumn.set(column, headingWords(th));
    }
    const byPosition = headings.map(headingWords);
    for (const row of Array.from(this.table.querySelectorAll<HTMLElement>('tbody tr'))) {
      Array.from(row.children).forEach((cell, position) => {
        if (!(cell instanceof HTMLTableCellElement) || cell.tagName !== 'TD') return;
        const column = columnOf(cell);
        const label = column === null ? byPosition[position] : byColumn.get(column);
        if (label !== undefined && cell.dataset['label'] !== label) cell.dataset['label'] = label;
      });
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
