import { ChangeDetectionStrategy, Component, Injectable, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogModule } from '@angular/material/dialog';
import { type Observable, map } from 'rxjs';

/** What a confirmation asks. */
export interface ConfirmQuestion {
  title: string;
  /** One or two sentences: what happens, and what stays (e.g. the change trail). */
  message: string;
  /** The words of the confirming button, e.g. "Delete the station". */
  confirmWords: string;
}

/** A question with two answers; the safe one (keep) has the focus. */
@Component({
  selector: 'rt-confirm-dialog',
  imports: [MatDialogModule, MatButtonModule],
  template: `
    <h2 mat-dialog-title>{{ question.title }}</h2>
    <mat-dialog-content>
      <p>{{ question.message }}</p>
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" [mat-dialog-close]="false">Keep it</button>
      <button mat-flat-button class="danger" type="button" [mat-dialog-close]="true">
        {{ question.confirmWords }}
      </button>
    </mat-dialog-actions>
  `,
  styles: `
    .danger {
      --mat-button-filled-container-color: var(--mat-sys-error);
      --mat-button-filled-label-text-color: var(--mat-sys-on-error);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ConfirmDialog {
  protected readonly question = inject<ConfirmQuestion>(MAT_DIALOG_DATA);
}

/** Asks for a confirmation in a Material dialog; answers true only when confirmed. */
@Injectable({ providedIn: 'root' })
export class Confirmer {
  private readonly dialog = inject(MatDialog);

  ask(question: ConfirmQuestion): Observable<boolean> {
    return this.dialog
      .open<ConfirmDialog, ConfirmQuestion, boolean>(ConfirmDialog, {
        data: question,
        role: 'alertdialog',
        width: '440px',
        autoFocus: 'first-tabbable',
      })
      .afterClosed()
      .pipe(map((answer) => answer === true));
  }
}
