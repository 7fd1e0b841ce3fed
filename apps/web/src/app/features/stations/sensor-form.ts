import type { AbstractControl, ValidationErrors } from '@angular/forms';
import {
  NonNullableFormBuilder,
  Validators,
  type FormControl,
  type FormGroup,
} from '@angular/forms';
import type {
  StationDto,
  StationSensor,
  ThermocoupleLetter,
  Thermometer,
} from '@rhotrace/api-types';
import { CALIBRATION_TABLE_MIN_POINTS } from '@rhotrace/api-types';
import { above } from '../../shared/field-error';

/** A calibration table needs this many rows at least (a cubic Hermite through 2 is a line). */
export const TABLE_MIN_ROWS = CALIBRATION_TABLE_MIN_POINTS;
/** Cold-junction temperatures the form takes, °C: an ice bath to a warm instrument terminal. */
export const REFERENCE_JUNCTION_RANGE_C = { min: -60, max: 150 } as const;

/** The sensor's own fields of the station form (`sensor.*` matches the API's field names). */
export type SensorGroup = FormGroup<{
  r0Ohm: FormControl<number | null>;
  type: FormControl<ThermocoupleLetter | ''>;
  referenceJunctionC: FormControl<number | null>;
  points: FormControl<string>;
}>;

/** The sensor fields; which apply follows the chosen thermometer (see `sensorOf`). */
export function sensorGroup(fb: NonNullableFormBuilder): SensorGroup {
  const { min, max } = REFERENCE_JUNCTION_RANGE_C;
  return fb.group({
    r0Ohm: fb.control<number | null>(null, above(0)),
    type: fb.control<ThermocoupleLetter | ''>(''),
    referenceJunctionC: fb.control<number | null>(null, [Validators.min(min), Validators.max(max)]),
    points: fb.control('', calibrationTableValidator),
  });
}

type Row = { reading: number; temperatureK: number };

/**
 * Reads a pasted calibration table: one row per line, a reading (V or Ω) and a temperature in K,
 * separated by a tab, a semicolon, a comma or spaces. A first line without numbers is a header;
 * blank lines are skipped. The temperature must rise or fall strictly with the reading, as the
 * import's interpolation needs. A problem names the line it is on.
 */
export function parseCalibrationTable(text: string): { points: Row[] } | { problem: string } {
  const rows: Array<Row & { line: number }> = [];
  const lines = text.split(/\r?\n/);
  for (const [i, raw] of lines.entries()) {
    const line = raw.trim();
    if (!line) continue;
    const cells = line.split(/\t|;|,\s*|\s+/).filter((c) => c !== '');
    const numbers = cells.map(Number);
    if (rows.length === 0 && numbers.every((n) => Number.isNaN(n))) continue;
    const where = `Row ${i + 1}`;
    if (cells.length !== 2) {
      return { problem: `${where}: give two values, a reading and a temperature in K` };
    }
    const bad = cells.find((c, k) => !Number.isFinite(numbers[k]));
    if (bad !== undefined) return { problem: `${where}: “${bad}” is not a number` };
    const [reading, temperatureK] = numbers as [number, number];
    if (!(temperatureK > 0)) {
      return { problem: `${where}: the temperature must be above 0 K (${temperatureK})` };
    }
    rows.push({ reading, temperatureK, line: i + 1 });
  }
  if (rows.length < TABLE_MIN_ROWS) {
    return {
      problem: `A calibration table needs at least ${TABLE_MIN_ROWS} rows (${rows.length} given)`,
    };
  }
  const problem = monotoneProblem(rows);
  return problem
    ? { problem }
    : { points: rows.map(({ reading, temperatureK }) => ({ reading, temperatureK })) };
}

/** Why the rows do not run one way, naming the first row that breaks it; null when they do. */
function monotoneProblem(rows: Array<Row & { line: number }>): string | null {
  const readingWay = Math.sign(rows[1]!.reading - rows[0]!.reading);
  const temperatureWay = Math.sign(rows[1]!.temperatureK - rows[0]!.temperatureK);
  const way = (s: number) => (s > 0 ? 'rise' : 'fall');
  for (let i = 1; i < rows.length; i++) {
    const a = rows[i - 1]!;
    const b = rows[i]!;
    const where = `Row ${b.line}`;
    if (b.reading === a.reading) {
      return `${where}: the reading ${b.reading} repeats row ${a.line}'s; each reading must differ`;
    }
    if (Math.sign(b.reading - a.reading) !== readingWay) {
      return `${where}: the reading ${b.reading} breaks the order of the rows above (they ${way(readingWay)}); sort the table by reading`;
    }
    const step = Math.sign(b.temperatureK - a.temperatureK);
    if (step === 0 || step !== temperatureWay) {
      return `${where}: the temperature ${b.temperatureK} K does not ${way(temperatureWay)} with the reading as in the rows above; the temperature must run one way with the reading`;
    }
  }
  return null;
}

/** Validator of the pasted table: the parse problem, shown as the field's error. */
export function calibrationTableValidator(control: AbstractControl): ValidationErrors | null {
  const text = String(control.value ?? '');
  if (!text.trim()) return null;
  const parsed = parseCalibrationTable(text);
  return 'problem' in parsed ? { order: parsed.problem } : null;
}

/** Makes the fields the chosen thermometer needs required (R0, or the table), the rest not. */
export function requireSensorFields(group: SensorGroup, kind: Thermometer): void {
  const { r0Ohm, points } = group.controls;
  for (const [control, needed] of [
    [r0Ohm, kind === 'platinum-rtd'],
    [points, kind === 'table'],
  ] as const) {
    if (needed) control.addValidators(Validators.required);
    else control.removeValidators(Validators.required);
    control.updateValueAndValidity({ emitEvent: false });
  }
}

/** The form's sensor fields as the API's `sensor` for the chosen thermometer. */
export function sensorOf(
  kind: Thermometer,
  v: ReturnType<SensorGroup['getRawValue']>,
): StationSensor {
  if (kind === 'platinum-rtd') return { kind, r0Ohm: v.r0Ohm! };
  if (kind === 'thermocouple') {
    const c = v.referenceJunctionC;
    return {
      kind,
      type: v.type || null,
      referenceJunctionK: c === null ? null : c + 273.15,
    };
  }
  const parsed = parseCalibrationTable(v.points);
  return { kind, points: 'points' in parsed ? parsed.points : [] };
}

/** A station's sensor as the form shows it. */
export function sensorFormValues(s: StationDto): ReturnType<SensorGroup['getRawValue']> {
  const sensor = s.sensor;
  const junctionK = sensor?.kind === 'thermocouple' ? sensor.referenceJunctionK : null;
  return {
    r0Ohm: sensor?.kind === 'platinum-rtd' ? sensor.r0Ohm : s.rtdR0Ohm,
    type: sensor?.kind === 'thermocouple' ? (sensor.type ?? '') : '',
    referenceJunctionC:
      junctionK === null || junctionK === undefined
        ? null
        : Number((junctionK - 273.15).toFixed(3)),
    points:
      sensor?.kind === 'table'
        ? sensor.points.map((p) => `${p.reading}\t${p.temperatureK}`).join('\n')
        : '',
  };
}

/** The station's thermometer in words, for the table. */
export function sensorWords(s: StationDto): string {
  const sensor = s.sensor;
  if (s.thermometer === 'platinum-rtd') return `Pt RTD, R0 ${s.rtdR0Ohm} Ω`;
  if (sensor?.kind === 'table') return `Calibration table, ${sensor.points.length} rows`;
  if (sensor?.kind === 'thermocouple' && sensor.type) {
    const k = sensor.referenceJunctionK;
    const junction =
      k === null || k === undefined ? '' : `, cold junction ${(k - 273.15).toFixed(1)} °C`;
    return `Type ${sensor.type} thermocouple${junction}`;
  }
  return 'Thermocouple (type from each file)';
}
