/**
 * Stage 4, pair polarities: a forward reading followed by a reverse one (or the other way
 * round) is one measurement with the current reversed, averaged into one point to cancel
 * thermal EMFs; any other reading stands alone.
 */
import type { Reading } from './import-types';
import { listRows } from './import-types';

/** One point's readings: forward first when paired. */
export interface ReadingGroup {
  forward: Reading;
  reverse?: Reading;
  /** `polarity-averaged` for a pair, `unpaired-polarity` for a lone reading with a polarity. */
  flag: 'polarity-averaged' | 'unpaired-polarity' | null;
}

/**
 * Pairs readings a slice at a time. A reading with a polarity at the end of a slice waits for
 * the next slice's first reading, its possible partner.
 */
export class PolarityPairer {
  private held: Reading | null = null;
  private readonly unpaired: number[] = [];

  /** The groups complete so far; `more` tells whether readings follow in a later slice. */
  pair(readings: Reading[], more: boolean): ReadingGroup[] {
    const all = this.held ? [this.held, ...readings] : readings;
    this.held = null;
    const last = all[all.length - 1];
    if (last && last.polarity !== 0 && more) this.held = all.pop()!;
    const groups: ReadingGroup[] = [];
    for (let i = 0; i < all.length; i++) {
      const a = all[i]!;
      const b = all[i + 1];
      if (a.polarity !== 0 && b !== undefined && b.polarity === -a.polarity) {
        i++;
        groups.push(
          a.polarity === 1
            ? { forward: a, reverse: b, flag: 'polarity-averaged' }
            : { forward: b, reverse: a, flag: 'polarity-averaged' },
        );
      } else if (a.polarity !== 0) {
        this.unpaired.push(a.row);
        groups.push({ forward: a, flag: 'unpaired-polarity' });
      } else {
        groups.push({ forward: a, flag: null });
      }
    }
    return groups;
  }

  /** The reading still held after the last slice, as a lone group. */
  finish(): ReadingGroup[] {
    const held = this.held;
    this.held = null;
    return held ? this.pair([held], false) : [];
  }

  /** The warning about readings left without a partner (none when all paired). */
  get warnings(): string[] {
    return this.unpaired.length
      ? [
          `${this.unpaired.length} reading(s) with a polarity but no opposite-polarity partner were stored on their own (rows ${listRows(this.unpaired)})`,
        ]
      : [];
  }
}
