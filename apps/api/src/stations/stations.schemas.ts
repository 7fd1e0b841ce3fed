import {
  CALIBRATION_TABLE_MIN_POINTS,
  STATION_SORT_FIELDS,
  THERMOCOUPLE_LETTERS,
  THERMOMETERS,
} from '@rhotrace/api-types';
import { z } from 'zod';
import {
  boundedLength,
  boundedNumber,
  isoDate,
  LIMITS,
  listQuerySchema,
  optionalText,
  requiredText,
  searchParam,
} from '../middleware/fields';

export const thermometer = z.enum(THERMOMETERS, {
  errorMap: () => ({ message: `must be one of ${THERMOMETERS.join(', ')}` }),
});

/** A station's thermometer; see `StationSensor`. A table needs 3 to 500 points. */
export const sensor = z.discriminatedUnion('kind', [
  z.object({ kind: z.literal('platinum-rtd'), r0Ohm: boundedNumber(1, 100_000, 'Ω') }).strict(),
  z
    .object({
      kind: z.literal('thermocouple'),
      type: z.enum(THERMOCOUPLE_LETTERS).nullable(),
      referenceJunctionK: boundedNumber(3, 2000, 'K').nullable().optional(),
    })
    .strict(),
  z
    .object({
      kind: z.literal('table'),
      points: z
        .array(
          z
            .object({ reading: z.number().finite(), temperatureK: boundedNumber(0.01, 2000, 'K') })
            .strict(),
        )
        .min(CALIBRATION_TABLE_MIN_POINTS, {
          message: `needs at least ${CALIBRATION_TABLE_MIN_POINTS} points (a straight line through two is no sensor calibration)`,
        })
        .max(500),
    })
    .strict(),
]);

export const fields = {
  name: requiredText(100),
  /** Four-point probe spacing: 10 µm to 1 cm. */
  probeSpacingCm: boundedLength(0.001, 1, 'probeSpacingCm'),
  tipRadiusCm: boundedLength(1e-6, 0.1, 'tipRadiusCm').nullable(),
  thermometer,
  /** A platinum RTD's resistance at 0 °C (Pt100: 100 Ω, Pt1000: 1000 Ω). */
  rtdR0Ohm: boundedNumber(1, 100_000, 'Ω').nullable(),
  sensor: sensor.nullable(),
  minTemperatureK: boundedNumber(0.01, 2000, 'K'),
  maxTemperatureK: boundedNumber(0.01, 2000, 'K'),
  calibratedOn: isoDate.nullable(),
  /** +/- half-widths read by the uncertainty budget of 23 °C values. */
  probeSpacingToleranceCm: boundedLength(0, 0.1, 'probeSpacingToleranceCm').nullable(),
  temperatureToleranceK: boundedNumber(0, 50, 'K').nullable(),
  notes: optionalText(LIMITS.notes),
};

export const createBody = z
  .object({
    ...fields,
    tipRadiusCm: fields.tipRadiusCm.optional().default(null),
    rtdR0Ohm: fields.rtdR0Ohm.optional().default(null),
    sensor: fields.sensor.optional(),
    calibratedOn: fields.calibratedOn.optional().default(null),
    probeSpacingToleranceCm: fields.probeSpacingToleranceCm.optional().default(null),
    temperatureToleranceK: fields.temperatureToleranceK.optional().default(null),
    notes: fields.notes.transform((v) => v ?? null),
  })
  .strict();

export const updateBody = z.object(fields).partial().strict();

export const listQuery = listQuerySchema(STATION_SORT_FIELDS, {
  q: searchParam,
  thermometer: thermometer.optional(),
});
