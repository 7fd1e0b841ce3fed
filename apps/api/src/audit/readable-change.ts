/**
 * The difference between an audit event's before and after states in words: each changed field
 * named as a person reads it, with its unit, and ids given as the records' names.
 */
import { LENGTH_UNIT_OF, cmToLength, type AuditChangeDto } from '@rhotrace/api-types';

/** Which kind of record an id field points to. */
export type NamedRecord = 'wafer' | 'lot' | 'station' | 'user' | 'sweep';

/** Names of the records ids point to, per kind (filled by `recordNames`). */
export type RecordNames = Record<NamedRecord, Map<number, string>>;

interface FieldWords {
  label: string;
  unit?: string;
  /** An id of this kind of record, shown as its name. */
  record?: NamedRecord;
}

/** Field names in words with their display units (values are stored in cm, K, ohm cm). */
const FIELDS: Record<string, FieldWords> = {
  number: { label: 'Number' },
  code: { label: 'Code' },
  name: { label: 'Name' },
  email: { label: 'E-mail' },
  role: { label: 'Role' },
  active: { label: 'Active' },
  material: { label: 'Material' },
  dopant: { label: 'Dopant' },
  supplier: { label: 'Supplier' },
  notes: { label: 'Notes' },
  state: { label: 'State' },
  task: { label: 'Task' },
  dueDate: { label: 'Due date' },
  specMinOhmCm: { label: 'Spec minimum', unit: 'Ω·cm' },
  specMaxOhmCm: { label: 'Spec maximum', unit: 'Ω·cm' },
  // Lengths are stored in cm and shown in their field's unit (LENGTH_UNIT_OF: µm or mm).
  thicknessCm: { label: 'Thickness' },
  thicknessToleranceCm: { label: 'Thickness tolerance' },
  tipRadiusCm: { label: 'Probe tip radius' },
  barLengthCm: { label: 'Bar length' },
  barWidthCm: { label: 'Bar width' },
  diameterCm: { label: 'Diameter' },
  spacingCm: { label: 'Probe spacing' },
  probeSpacingCm: { label: 'Probe spacing' },
  probeSpacingToleranceCm: { label: 'Probe spacing tolerance' },
  temperatureToleranceK: { label: 'Temperature tolerance', unit: 'K' },
  minTemperatureK: { label: 'Lowest temperature', unit: 'K' },
  maxTemperatureK: { label: 'Highest temperature', unit: 'K' },
  thermometer: { label: 'Thermometer' },
  rtdR0Ohm: { label: 'Thermometer R0', unit: 'Ω' },
  calibratedOn: { label: 'Calibrated on' },
  receivedOn: { label: 'Received on' },
  location: { label: 'Location' },
  waferId: { label: 'Wafer', record: 'wafer' },
  lotId: { label: 'Lot', record: 'lot' },
  stationId: { label: 'Station', record: 'station' },
  sweepId: { label: 'Sweep', record: 'sweep' },
  countedSweepId: { label: 'Sweep that counts at 23 °C', record: 'sweep' },
  assigneeId: { label: 'Assignee', record: 'user' },
  assignedById: { label: 'Assigned by', record: 'user' },
  uploadedById: { label: 'Uploaded by', record: 'user' },
  createdById: { label: 'Created by', record: 'user' },
  passwordChanged: { label: 'Password' },
  originalName: { label: 'File' },
  method: { label: 'Method' },
  pointCount: { label: 'Points' },
  kind: { label: 'Fit kind' },
};

/** Bookkeeping fields that say nothing to a reader. */
const HIDDEN = new Set(['id', 'createdAt', 'updatedAt', 'deletedAt', 'tokenVersion', 'sha256']);

/** `specMaxOhmCm` → "Spec max ohm cm" for a field this table does not know. */
function wordsOf(field: string): string {
  const spaced = field.replace(/([a-z0-9])([A-Z])/g, '$1 $2').toLowerCase();
  return spaced.charAt(0).toUpperCase() + spaced.slice(1);
}

/** The ids a state points to, by kind, so their names can be read in one query per kind. */
export function referencedIds(states: unknown[]): Record<NamedRecord, Set<number>> {
  const ids: Record<NamedRecord, Set<number>> = {
    wafer: new Set(),
    lot: new Set(),
    station: new Set(),
    user: new Set(),
    sweep: new Set(),
  };
  for (const state of states) {
    if (!isObject(state)) continue;
    for (const [field, value] of Object.entries(state)) {
      const kind = FIELDS[field]?.record;
      if (kind && typeof value === 'number') ids[kind].add(value);
    }
  }
  return ids;
}

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/** One value as a reader sees it: units applied, ids named, yes/no, an em dash for nothing. */
export function showValue(field: string, value: unknown, names: RecordNames): string {
  if (value === null || value === undefined || value === '') return '—';
  const words = FIELDS[field];
  if (words?.record && typeof value === 'number') {
    const name = names[words.record].get(value);
    return name ?? `${words.record} ${value} (no longer on record)`;
  }
  if (field === 'passwordChanged') return value === true ? 'changed' : 'unchanged';
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'number') {
    const lengthUnit = LENGTH_UNIT_OF[field];
    const shown = lengthUnit ? cmToLength(value, lengthUnit) : value;
    const a = Math.abs(shown);
    const text =
      a !== 0 && (a >= 1e6 || a < 1e-3)
        ? shown.toExponential(3).replace(/e\+?/, ' × 10^')
        : Number.isInteger(shown)
          ? String(shown)
          : String(Number(shown.toPrecision(6)));
    const unit = lengthUnit ?? words?.unit;
    return unit ? `${text} ${unit}` : text;
  }
  if (typeof value === 'string') {
    return /^\d{4}-\d{2}-\d{2}T/.test(value) ? value.slice(0, 10) : value;
  }
  if (Array.isArray(value)) {
    // Lists of keys (a fit's freed parameters) are read as words too.
    const word = (v: unknown) =>
      typeof v === 'string' && /^[a-z]+[A-Z]\w*$/.test(v)
        ? (FIELDS[v]?.label ?? wordsOf(v)).toLowerCase()
        : showValue(field, v, names);
    return value.length === 0 ? '—' : value.map(word).join(', ');
  }
  if (isObject(value)) {
    // A nested record (geometry, fit parameters): each entry in words, never its stored key.
    const parts = Object.entries(value)
      .filter(([k, v]) => !HIDDEN.has(k) && v !== null && v !== undefined)
      .map(
        ([k, v]) => `${(FIELDS[k]?.label ?? wordsOf(k)).toLowerCase()} ${showValue(k, v, names)}`,
      );
    return parts.length ? parts.join(', ') : '—';
  }
  return String(value);
}

/** Every field whose value differs between `before` and `after` (either may be null). */
export function readableChanges(
  before: unknown,
  after: unknown,
  names: RecordNames,
): AuditChangeDto[] {
  const b = isObject(before) ? before : {};
  const a = isObject(after) ? after : {};
  const fields = [...new Set([...Object.keys(b), ...Object.keys(a)])].filter((f) => !HIDDEN.has(f));
  const changes: AuditChangeDto[] = [];
  for (const field of fields) {
    if (JSON.stringify(b[field] ?? null) === JSON.stringify(a[field] ?? null)) continue;
    changes.push({
      field,
      label: FIELDS[field]?.label ?? wordsOf(field),
      before: isObject(before) ? showValue(field, b[field], names) : null,
      after: isObject(after) ? showValue(field, a[field], names) : null,
    });
  }
  return changes;
}
