/**
 * Removes raw-file objects that no sweep names. An object is written before its upload's
 * transaction commits and deleted again when the transaction rolls back; only an API process
 * that dies between the two leaves one behind. Such an object holds no sweep data (the sweep
 * never committed), but it takes space and holds a lab's file: this finds and deletes it.
 */
import { QueryTypes, type Sequelize } from 'sequelize';
import type { S3RawStorage } from './s3-raw-storage';

/**
 * How old an unreferenced object must be before it goes, s. Far longer than any upload takes
 * (the server's request timeout is two minutes), so an upload still in flight keeps its object.
 */
export const ORPHAN_GRACE_S = 60 * 60;

/**
 * Deletes every object of `storage` older than `ORPHAN_GRACE_S` that no sweep, deleted or not,
 * names as its `s3` raw file. Returns how many objects were looked at and how many went.
 */
export async function removeOrphanedObjects(
  sequelize: Sequelize,
  storage: S3RawStorage,
  now = new Date(),
): Promise<{ checked: number; deleted: number }> {
  let checked = 0;
  let deleted = 0;
  for await (const keys of storage.keysWrittenBefore(
    new Date(now.getTime() - ORPHAN_GRACE_S * 1000),
  )) {
    checked += keys.length;
    // soft-deleted sweeps keep their raw file for the trail, so they count as referencing it
    const rows = await sequelize.query<{ key: string }>(
      "SELECT storage_key AS `key` FROM sweeps WHERE storage_kind = 's3' AND storage_key IN (?)",
      { replacements: [keys], type: QueryTypes.SELECT },
    );
    const referenced = new Set(rows.map((r) => r.key));
    for (const key of keys) {
      if (referenced.has(key)) continue;
      await storage.delete(key);
      deleted += 1;
    }
  }
  return { checked, deleted };
}
