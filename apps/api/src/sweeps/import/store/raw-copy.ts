/**
 * The raw file of one upload attempt: written to the configured storage inside the upload's
 * transaction (the database) or beside it (an object store), and removed again when the
 * upload does not commit.
 */
import type { Transaction } from 'sequelize';
import type { RawStorage } from '../../../storage/raw-storage';

/** One attempt's raw copy; `put` at most once, then `discard` if nothing commits. */
export class RawCopy {
  private key: Promise<string> | null = null;

  constructor(readonly storage: RawStorage) {}

  /** Starts the write; the key resolves once it is stored. */
  put(content: Buffer, transaction: Transaction): Promise<string> {
    const key = this.storage.put(content, { transaction });
    key.catch(() => undefined); // awaited by the caller; never an unhandled rejection
    this.key = key;
    return key;
  }

  /** Waits for a write in flight, so a rollback never races it on the same connection. */
  async settle(): Promise<void> {
    await this.key?.catch(() => undefined);
  }

  /**
   * Removes the copy of an upload that did not commit: an object store's, and a database copy
   * that escaped its rolled-back transaction (written in autocommit after a silent abort).
   * Never throws: the import's own error is what the caller must see, and an orphaned copy
   * holds no sweep data.
   */
  async discard(): Promise<void> {
    if (!this.key) return;
    try {
      await this.storage.delete(await this.key);
    } catch {
      // the put itself failed (nothing stored) or the store is unreachable
    }
  }
}
