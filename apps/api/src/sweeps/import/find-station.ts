/**
 * The station an upload names: by id from the request (a 400 when it does not exist), or by the
 * name in the file's header (a warning when none is registered under it).
 */
import type { Transaction } from 'sequelize';
import { validationFailed } from '../../errors';
import { Station } from '../../stations/station.model';

/** The station, or null; a name with no station adds a warning to `warnings`. */
export async function findStation(
  stationId: number | null | undefined,
  stationName: string | undefined,
  warnings: string[],
  transaction?: Transaction,
): Promise<Station | null> {
  if (stationId) {
    const station = await Station.findByPk(stationId, { transaction });
    if (!station) {
      throw validationFailed('The station does not exist', [
        { field: 'stationId', problem: `there is no station ${stationId}` },
      ]);
    }
    return station;
  }
  if (!stationName) return null;
  const station = await Station.findOne({ where: { name: stationName }, transaction });
  if (!station) {
    warnings.push(
      `the file names station "${stationName}", which is not registered; no station was linked`,
    );
  }
  return station;
}
