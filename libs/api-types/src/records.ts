import type { AssignmentPlanDto } from './planner';
/** Semiconductor wafer materials Rhotrace models. */
export const SEMICONDUCTORS = ['Si', 'Ge', 'GaAs', '4H-SiC'] as const;
/** Metal-film test wafers Rhotrace knows reference data for. */
export const METAL_FILMS = ['W', 'Cu', 'Al', 'Pt', 'Au', 'Ni'] as const;
export const MATERIALS = [...SEMICONDUCTORS, ...METAL_FILMS] as const;
export type Material = (typeof MATERIALS)[number];

/** Where a wafer is in the lab's flow (Rhotrace's own words). */
export const WAFER_STATES = [
  'received',
  'queued',
  'measuring',
  'measured',
  'on hold',
  'retired',
] as const;
export type WaferState = (typeof WAFER_STATES)[number];

export const ASSIGNMENT_STATES = ['assigned', 'in progress', 'done', 'cancelled'] as const;
export type AssignmentState = (typeof ASSIGNMENT_STATES)[number];

export const THERMOMETERS = ['thermocouple', 'platinum-rtd', 'table'] as const;
export type Thermometer = (typeof THERMOMETERS)[number];

/** The letter-designated thermocouple types (IEC 60584-1; the physics library's list). */
export const THERMOCOUPLE_LETTERS = ['B', 'E', 'J', 'K', 'N', 'R', 'S', 'T'] as const;
/**
 * Fewest points a station's calibration table may have: through two points the monotone cubic
 * Hermite is a straight line, which is no calibration of a diode or resistance sensor's curve.
 */
export const CALIBRATION_TABLE_MIN_POINTS = 3;
export type ThermocoupleLetter = (typeof THERMOCOUPLE_LETTERS)[number];

/**
 * A station's thermometer and how its readings become kelvin:
 * - `platinum-rtd`: IEC 60751 with resistance `r0Ohm` at 0 °C (readings in ohms);
 * - `thermocouple`: ITS-90 reference function of `type` (null: not stated yet), readings in mV
 *   or V, with the cold junction at `referenceJunctionK` unless the file states it;
 * - `table`: the sensor's own calibration, readings in volts (diodes) or ohms (resistance
 *   sensors), interpolated by monotone cubic Hermite.
 */
export type StationSensor =
  | { kind: 'platinum-rtd'; r0Ohm: number }
  | { kind: 'thermocouple'; type: ThermocoupleLetter | null; referenceJunctionK?: number | null }
  | { kind: 'table'; points: Array<{ reading: number; temperatureK: number }> };

export interface LotDto {
  id: number;
  code: string;
  material: Material;
  dopant: string | null;
  dopantType: 'n' | 'p' | null;
  orientation: string | null;
  diameterCm: number | null;
  thicknessCm: number | null;
  /** +/- thickness tolerance (half-width of a rectangular distribution), cm. */
  thicknessToleranceCm: number | null;
  supplier: string | null;
  receivedOn: string | null;
  specMinOhmCm: number | null;
  specMaxOhmCm: number | null;
  notes: string | null;
  waferCount?: number;
  createdAt: string;
  updatedAt: string;
}

export type LotInput = Omit<LotDto, 'id' | 'createdAt' | 'updatedAt' | 'waferCount'>;

export interface WaferDto {
  id: number;
  lotId: number;
  lotCode?: string;
  number: string;
  thicknessCm: number | null;
  state: WaferState;
  notes: string | null;
  /** The sweep chosen to give the 23 °C value; null: the newest that reaches 23 °C counts. */
  countedSweepId: number | null;
  createdAt: string;
  updatedAt: string;
}

export interface StationDto {
  id: number;
  name: string;
  probeSpacingCm: number;
  tipRadiusCm: number | null;
  /** The sensor's kind (kept for older clients; `sensor` says the whole of it). */
  thermometer: Thermometer;
  /** A platinum RTD's R0 (kept for older clients; the same as `sensor.r0Ohm`). */
  rtdR0Ohm: number | null;
  /** The thermometer and its conversion; absent from older clients' input. */
  sensor?: StationSensor | null;
  minTemperatureK: number;
  maxTemperatureK: number;
  calibratedOn: string | null;
  /** The day the calibration falls due under the lab's interval (null without a date). */
  calibrationDueOn?: string | null;
  /** True once that day has passed: the station is marked and uploads from it are warned. */
  calibrationOverdue?: boolean;
  /** +/- probe spacing tolerance (half-width), cm; null or absent when not stated. */
  probeSpacingToleranceCm?: number | null;
  /** +/- thermometer tolerance (half-width), K; null or absent: the sensor class is assumed. */
  temperatureToleranceK?: number | null;
  notes: string | null;
  createdAt: string;
  updatedAt: string;
}

export interface AssignmentDto {
  id: number;
  waferId: number;
  waferNumber?: string;
  lotCode?: string;
  assigneeId: number;
  assigneeName?: string;
  assignedById: number;
  task: string;
  dueDate: string;
  state: AssignmentState;
  notes: string | null;
  overdue: boolean;
  /** Safety notes for this task and wafer material (they defer to the lab's own rules). */
  safetyCautions?: string[];
  /** The probe station the wafer is to be measured on; its token may post the sweep. */
  stationId?: number | null;
  /** The sweep the station posted for this assignment, when one did. */
  stationUpload?: AssignmentStationUpload | null;
  /** The measurement plan attached to the assignment, when one is. */
  plan?: AssignmentPlanDto | null;
  /** The sweeps the assignee uploaded that fulfil this task, oldest first. */
  sweeps?: AssignmentSweepDto[];
  createdAt: string;
  updatedAt: string;
}

/** One changed field of an audit event, in words: values with units, ids as names. */
export interface AuditChangeDto {
  /** The stored field name (for scripts); `label` is what people read. */
  field: string;
  label: string;
  /** null when the record did not exist before (created) or after (deleted). */
  before: string | null;
  after: string | null;
}

/** A sweep that fulfils a task (uploaded by its assignee to the task's wafer). */
export interface AssignmentSweepDto {
  id: number;
  originalName: string;
  createdAt: string;
}

/** A station's post that fulfilled an assignment. */
export interface AssignmentStationUpload {
  sweepId: number;
  stationName: string;
  tokenLabel: string;
  postedAt: string;
}

export interface AuditEventDto {
  id: number;
  actorId: number | null;
  actorEmail?: string | null;
  action: string;
  entity: string;
  entityId: string;
  before: unknown;
  after: unknown;
  requestId: string | null;
  /** The record in words, e.g. "wafer W03 of lot L-7" or "task on wafer W03 of lot L-7". */
  recordName: string | null;
  /** The fields that changed, in words. */
  changes: AuditChangeDto[];
  createdAt: string;
}

/** Fields each list sorts by: `sort=field` ascending, `sort=-field` descending. */
export const LOT_SORT_FIELDS = [
  'code',
  'material',
  'receivedOn',
  'supplier',
  'specMinOhmCm',
  'specMaxOhmCm',
  'createdAt',
  'updatedAt',
] as const;
export const WAFER_SORT_FIELDS = ['number', 'state', 'lotId', 'createdAt', 'updatedAt'] as const;
export const STATION_SORT_FIELDS = ['name', 'thermometer', 'calibratedOn', 'createdAt'] as const;
export const ASSIGNMENT_SORT_FIELDS = ['dueDate', 'state', 'createdAt', 'updatedAt'] as const;

/** `GET /api/lots` filters (plus page, pageSize, sort). `q` searches code, supplier, dopant, notes. */
export interface LotListQuery {
  page?: number;
  pageSize?: number;
  sort?: string;
  q?: string;
  material?: Material;
  dopantType?: 'n' | 'p';
}

/** `GET /api/wafers` and `GET /api/lots/:id/wafers` filters. `q` searches number and notes. */
export interface WaferListQuery {
  page?: number;
  pageSize?: number;
  sort?: string;
  q?: string;
  lotId?: number;
  state?: WaferState;
  material?: Material;
}

/** `GET /api/assignments` filters; technicians may only ask for their own (`assignee=me`). */
export interface AssignmentListQuery {
  page?: number;
  pageSize?: number;
  sort?: string;
  assignee?: 'me' | number;
  state?: AssignmentState;
  waferId?: number;
  overdue?: 'true' | 'false';
}

export type WaferInput = Pick<WaferDto, 'number' | 'thicknessCm' | 'notes'> & {
  state?: WaferState;
  /** `PATCH` only: the sweep that counts for the 23 °C value (null: the newest). */
  countedSweepId?: number | null;
};
export type StationInput = Omit<StationDto, 'id' | 'createdAt' | 'updatedAt'>;

export interface CreateAssignmentRequest {
  waferId: number;
  assigneeId: number;
  task: string;
  dueDate: string;
  notes?: string | null;
  stationId?: number | null;
}

export interface UpdateAssignmentRequest {
  state?: AssignmentState;
  task?: string;
  dueDate?: string;
  notes?: string | null;
  assigneeId?: number;
  stationId?: number | null;
}

/** `GET /api/audit` filters: `entity` (lot, wafer, station, assignment, user), `id`, `actorId`. */
export interface AuditListQuery {
  page?: number;
  pageSize?: number;
  entity?: string;
  id?: string | number;
  actorId?: number;
  action?: string;
}
