import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { Icon } from './icon';

/** Toxic when broken or abraded (compound semiconductors containing arsenic). */
const TOXIC_MATERIALS = new Set(['GaAs']);

/**
 * The safety caution shown where a sweep is planned or uploaded and where a task is assigned.
 * It names the hazards of the work and defers to the lab's own rules.
 */
@Component({
  selector: 'rt-caution',
  imports: [Icon],
  template: `
    <aside class="caution" role="note" aria-label="Safety caution">
      <rt-icon name="warn" class="mark" />
      <div>
        <strong>Before you measure</strong>
        <ul>
          <li>Hot chucks burn; let the stage cool before touching the wafer or the probes.</li>
          <li>
            Cryogens freeze skin and displace oxygen; use them only where the room is ventilated.
          </li>
          <li>Probe current heats small samples and can damage thin films; start low.</li>
          @if (magnet()) {
            <li>
              A Hall magnet's field reaches beyond the poles: keep pacemakers and other implants out
              of the marked zone, loose steel away, and cards, watches and phones outside.
            </li>
          }
          @if (toxic()) {
            <li>
              <strong>{{ material() }}</strong> is toxic when broken or abraded; handle fragments as
              hazardous waste.
            </li>
          } @else {
            <li>
              Some compound semiconductors (GaAs and others) are toxic when broken or abraded.
            </li>
          }
        </ul>
        <p>Your lab's own safety rules, local codes and licensed practice come first.</p>
      </div>
    </aside>
  `,
  styles: `
    .caution {
      display: flex;
      gap: 12px;
      padding: 12px 16px;
      border-radius: 12px;
      border-left: 4px solid var(--rt-caution-border);
      background: var(--rt-caution-bg);
      color: var(--mat-sys-on-surface);
      font: var(--mat-sys-body-medium);
      margin: 12px 0;
    }
    .mark {
      color: var(--rt-caution-border);
      margin-top: 2px;
    }
    ul {
      margin: 4px 0;
      padding-left: 18px;
    }
    p {
      margin: 4px 0 0;
      font: var(--mat-sys-body-small);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Caution {
  /** Material being handled, when known (adds its own hazard). */
  readonly material = input<string | null | undefined>(null);
  /** True where the work uses a Hall magnet (adds the strong-field cautions). */
  readonly magnet = input(false);
  protected readonly toxic = computed(() => TOXIC_MATERIALS.has(this.material() ?? ''));
}
