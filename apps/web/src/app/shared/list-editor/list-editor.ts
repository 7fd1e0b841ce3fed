import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';

/**
 * The screen of a register edited in place (people, probe stations): a title with an "add"
 * button, the editor form above the table while one record is being edited, and the table.
 * The form comes in marked `rtEditorForm`; everything else projected is the table.
 */
@Component({
  selector: 'rt-list-editor',
  imports: [MatButtonModule],
  template: `
    <div class="rt-page">
      <div class="rt-row">
        <h1 class="rt-page-title">{{ heading() }}</h1>
        <span class="rt-spacer"></span>
        @if (canAdd() && !open()) {
          <button mat-flat-button type="button" (click)="add.emit()">{{ addLabel() }}</button>
        }
      </div>
      @if (open()) {
        <div class="editor">
          @if (problem(); as p) {
            <p class="problem" role="alert">{{ p }}</p>
          }
          <ng-content select="[rtEditorForm]" />
        </div>
      }
      <div class="rt-table-wrap">
        <ng-content />
      </div>
    </div>
  `,
  styles: `
    .editor {
      border: 1px solid var(--mat-sys-outline-variant);
      border-radius: 16px;
      padding: 12px 16px;
      margin-bottom: 16px;
    }
    .problem {
      color: var(--mat-sys-error);
    }
    :host ::ng-deep table {
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ListEditor {
  readonly heading = input.required<string>();
  readonly addLabel = input.required<string>();
  /** Whether this person may add records. */
  readonly canAdd = input(true);
  /** Whether the editor form is shown. */
  readonly open = input.required<boolean>();
  /** The server's answer to the last save, when it refused it. */
  readonly problem = input<string | null>(null);
  readonly add = output();
}
