/** Semiconductor wafer materials Rhotrace models. */
export const SEMICONDUCTORS = ['Si', 'Ge', 'GaAs', '4H-SiC'] as const;
/** Metal-film test wafers Rhotrace knows reference data for. */
export const METAL_FILMS = ['W', 'Cu', 'Al', 'Pt', 'Au', 'Ni'] as const;
export const MATERIALS = [...SEMICONDUCTORS, ...METAL_FILMS] as const;
export type Material = (typeof MATERIALS)[number];

/** Where a wafer is in the lab's flow (Rhotrace's own words). */
export const WAFER_STATES = ['received', 'queued', 'measuring', 'measured', 'on hold', 'retired'] as const;
export type WaferState = (typeof WAFER_STATES)[number];

export const ASSIGNMENT_STATES = ['assigned', 'in progress', 'done', 'cancelled'] as const;
export type AssignmentState = (typeof ASSIGNMENT_STATES)[number];

export const THERMOMETERS = ['thermocouple', 'platinum-rtd'] as const;
export type Thermometer = (typeof THERMOMETERS)[number];

export interface LotDto {
  id: number;
  code: string;
  material: Material;
  dopant: string | null;
  dopantType: 'n' | 'p' | null;
  orientation: string | null;
  diameterCm: number | null;
  thicknessCm: number | null;
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
  createdAt: string;
  updatedAt: string;
}

export interface StationDto {
  id: number;
  name: string;
  probeSpacingCm: number;
  tipRadiusCm: number | null;
  thermometer: Thermometer;
  rtdR0Ohm: number | null;
  minTemperatureK: number;
  maxTemperatureK: number;
  calibratedOn: string | null;
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
  createdAt: string;
  updatedAt: string;
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
  createdAt: string;
}
