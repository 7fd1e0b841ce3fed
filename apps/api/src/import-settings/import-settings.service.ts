/**
 * Saved import settings: one per station and file shape, offered by the preview when a file of
 * that shape from that station arrives again. Saving again replaces them; every change is
 * audited.
 */
import type { ImportSettingsDto, ImportSettingsInput } from '@rhotrace/api-types';
import type { Transaction } from 'sequelize';
import { auditChange, type Actor } from '../audit/audit.service';
import { inTransaction } from '../db/connection';
import { notFound, validationFailed } from '../errors';
import { Station } from '../stations/station.model';
import { User } from '../users/user.model';
import { ImportSettings, type ImportMethodDetails } from './import-settings.model';

async function toDto(s: ImportSettings, transaction?: Transaction): Promise<ImportSettingsDto> {
  const [station, savedBy] = await Promise.all([
    Station.findByPk(s.stationId, { attributes: ['name'], transaction }),
    s.savedById === null ? null : User.findByPk(s.savedById, { attributes: ['name'], transaction }),
  ]);
  return {
    id: s.id,
    stationId: s.stationId,
    stationName: station?.name ?? null,
    shape: s.shapeSha256,
    shapeLabel: s.shapeLabel,
    method: s.method,
    columns: s.columns,
    geometry: s.geometry,
    layout: s.layout,
    savedById: s.savedById,
    savedByName: savedBy?.name ?? null,
    updatedAt: s.updatedAt.toISOString(),
    hallFactor: s.methodDetails?.hallFactor ?? null,
    map: s.methodDetails?.map ?? null,
  };
}

/**
 * The method's own fields worth saving: a Hall factor only for the hall method, map fields only
 * where they were given (a map is a four-point file with site columns); null when none.
 */
function methodDetailsOf(input: ImportSettingsInput): ImportMethodDetails | null {
  const details: ImportMethodDetails = {};
  if (input.method === 'hall' && input.hallFactor !== undefined)
    details.hallFactor = input.hallFactor;
  if (input.map && Object.values(input.map).some((v) => v !== undefined)) details.map = input.map;
  return Object.keys(details).length ? details : null;
}

/** The settings saved for a station and shape, or null. */
export async function findImportSettings(
  stationId: number | null,
  shape: string,
): Promise<ImportSettingsDto | null> {
  if (stationId === null) return null;
  const found = await ImportSettings.findOne({ where: { stationId, shapeSha256: shape } });
  return found ? toDto(found) : null;
}

/** Every saved setting of a station (or of all stations), newest first. */
export async function listImportSettings(stationId?: number): Promise<ImportSettingsDto[]> {
  const rows = await ImportSettings.findAll({
    where: stationId === undefined ? {} : { stationId },
    order: [['updatedAt', 'DESC']],
    limit: 500,
  });
  return Promise.all(rows.map((r) => toDto(r)));
}

/**
 * Saves the settings of a station and shape, replacing earlier ones. 400 for a station that
 * does not exist.
 */
export async function saveImportSettings(
  input: ImportSettingsInput,
  actor: Actor,
): Promise<ImportSettingsDto> {
  return inTransaction(async (transaction) => {
    const station = await Station.findByPk(input.stationId, { transaction });
    if (!station) {
      throw validationFailed('The station does not exist', [
        { field: 'body.stationId', problem: `there is no station ${input.stationId}` },
      ]);
    }
    const values = {
      stationId: input.stationId,
      shapeSha256: input.shape,
      shapeLabel: input.shapeLabel ?? 'files of this shape',
      method: input.method,
      columns: input.columns,
      geometry: input.geometry,
      layout: input.layout,
      methodDetails: methodDetailsOf(input),
      savedById: actor.id,
    };
    const earlier = await ImportSettings.findOne({
      where: { stationId: input.stationId, shapeSha256: input.shape },
      transaction,
      lock: transaction.LOCK.UPDATE,
    });
    const before = earlier ? await toDto(earlier, transaction) : undefined;
    const saved = earlier
      ? await earlier.update(values, { transaction })
      : await ImportSettings.create(values, { transaction });
    const after = await toDto(saved, transaction);
    await auditChange(
      transaction,
      actor,
      earlier ? 'update' : 'create',
      'import-settings',
      saved.id,
      {
        before,
        after,
      },
    );
    return after;
  });
}

/** Deletes saved settings (404 when there are none under that id). */
export async function deleteImportSettings(id: number, actor: Actor): Promise<void> {
  await inTransaction(async (transaction) => {
    const found = await ImportSettings.findByPk(id, { transaction });
    if (!found) throw notFound(`Import settings ${id}`);
    const before = await toDto(found, transaction);
    await found.destroy({ transaction });
    await auditChange(transaction, actor, 'delete', 'import-settings', id, { before });
  });
}
