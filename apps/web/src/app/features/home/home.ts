import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { Session } from '../../core/auth/session';
import { EngineerDesk } from './engineer-desk';
import { ManagerBoard } from './manager-board';
import { PhysicistDesk } from './physicist-desk';
import { TechnicianQueue } from './technician-queue';

/** The bench: what the signed-in role needs first. */
@Component({
  selector: 'rt-home',
  imports: [TechnicianQueue, ManagerBoard, EngineerDesk, PhysicistDesk],
  template: `
    <div class="rt-page">
      <h1 class="rt-page-title">{{ greeting() }}</h1>
      @switch (role()) {
        @case ('technician') {
          <rt-technician-queue />
        }
        @case ('manager') {
          <rt-manager-board />
        }
        @case ('admin') {
          <rt-manager-board /> <rt-engineer-desk />
        }
        @case ('engineer') {
          <rt-engineer-desk />
        }
        @case ('physicist') {
          <rt-physicist-desk />
        }
      }
    </div>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Home {
  private readonly session = inject(Session);
  protected readonly role = this.session.role;
  protected readonly greeting = computed(() => {
    const first = this.session.user()?.name.split(' ')[0] ?? '';
    return `Bench of ${first}`.trim();
  });
}
