import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { AuditEventDto } from '@rhotrace/api-types';

/** What happened, in words: "created", "changed", "deleted", and the like. */
const ACTION_WORDS: Readonly<Record<string, string>> = {
  create: 'created',
  update: 'changed',
  delete: 'deleted',
  restore: 'restored',
  'sign-in': 'signed in',
  'password-reset': 'reset the password of',
};

/** One audit event's changed fields as "Label: before → after" lines. */
@Component({
  selector: 'rt-change-list',
  template: `
    <p class="head">
      <span class="who">{{ event().actorEmail ?? 'Rhotrace' }}</span>
      {{ action() }}
      <span class="what">{{ event().recordName ?? event().entity + ' ' + event().entityId }}</span>
    </p>
    @if (event().changes.length) {
      <ul class="changes">
        @for (c of event().changes; track c.field) {
          <li>
            <span class="label">{{ c.label }}:</span>{{ ' ' }}
            @if (c.before !== null && c.after !== null) {
              <span class="before">{{ c.before }}</span> → <span>{{ c.after }}</span>
            } @else {
              <span>{{ c.after ?? c.before }}</span>
            }
          </li>
        }
      </ul>
    }
  `,
  styles: `
    .head {
      margin: 0;
    }
    .who,
    .what,
    .label {
      font-weight: 600;
    }
    .changes {
      margin: 4px 0 0;
      padding-left: 18px;
    }
    .before {
      text-decoration: line-through;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChangeList {
  readonly event = input.required<AuditEventDto>();
  protected action(): string {
    return ACTION_WORDS[this.event().action] ?? this.event().action;
  }
}
