/**
 * The measurement planner: `POST /api/planner` and the plan an assignment carries.
 */
import type { DopingInput, RegimeName } from './analysis';

/** How the planned temperatures are spread: evenly in T, or evenly in 1/T. */
export const PLAN_SPACINGS = ['linear', 'inverse'] as const;
export type PlanSpacing = (typeof PLAN_SPACINGS)[number];

/** Probe arrangements the planner computes the voltage for. */
export const PLAN_METHODS = ['four-point', 'van-der-pauw'] as const;
export type PlanMethodName = (typeof PLAN_METHODS)[number];

/** What set a step's probe current. */
export const CURRENT_LIMITS = [
  'target-voltage',
  'max-voltage',
  'max-power',
  'min-current',
  'max-current',
] as const;
export type CurrentLimitName = (typeof CURRENT_LIMITS)[number];

/**
 * `POST /api/planner` body. Either `waferId` (material, doping, thickness and diameter from the
 * wafer and its lot) or `material` with `doping` (semiconductors) and `thicknessCm`. `doping`
 * given with a wafer overrides the lot's. Geometry and temperature limits come from the station.
 */
export interface PlannerRequest {
  waferId?: number;
  material?: string;
  doping?: DopingInput;
  thicknessCm?: number;
  diameterCm?: number;
  stationId: number;
  /** Default 'four-point'. */
  method?: PlanMethodName;
  minK: number;
  maxK: number;
  /** 2 to 500 steps. */
  count: number;
  spacing: PlanSpacing;
  targetVoltageV: number;
  maxVoltageV: number;
  maxPowerW: number;
  minCurrentA?: number;
  maxCurrentA?: number;
  dwellS?: number;
  rampKPerMin?: number;
  denseAroundTransitions?: boolean;
}

/** One planned step. */
export interface PlanStepDto {
  temperatureK: number;
  expectedResistivityOhmCm: number;
  expectedSheetResistanceOhmSq: number;
  /** The model's regime at this temperature; null for a metal film. */
  regime: RegimeName | null;
  currentA: number;
  voltageV: number;
  powerW: number;
  limitedBy: CurrentLimitName;
}

/** One probe current held over consecutive steps (sources switch ranges between them). */
export interface PlanCurrentRangeDto {
  fromK: number;
  toK: number;
  stepCount: number;
  currentA: number;
  limitedBy: CurrentLimitName;
}

/** What the plan was computed from, stated so that every number can be traced. */
export interface PlanBasisDto {
  material: string;
  doping: DopingInput | null;
  /** Where the doping came from, in words (the request, or the lot's spec through ASTM F723). */
  dopingSource: string;
  thicknessCm: number;
  diameterCm: number | null;
  method: PlanMethodName;
  probeSpacingCm: number | null;
  stationId: number;
  stationName: string;
  stationRangeK: [number, number];
  /** The meter's readable window, V: [maxVoltageV / 1000, maxVoltageV]. */
  readableVoltageV: [number, number];
  maxPowerW: number;
  dwellS: number;
  rampKPerMin: number;
  modelVersion: string;
}

/** `POST /api/planner` answer. */
export interface PlannerResponse {
  steps: PlanStepDto[];
  /** The model's freeze-out and intrinsic boundaries; null for a metal film. */
  regimeBoundaries: { freezeOutBelowK: number | null; intrinsicAboveK: number | null } | null;
  currentRanges: PlanCurrentRangeDto[];
  /** Ramps from room temperature, between steps and back, plus a dwell per step, s. */
  estimatedDurationS: number;
  /** Safety cautions for this plan; they defer to the lab's own rules. */
  cautions: string[];
  /** Where the plan falls short (a voltage outside the meter's window, heating, the model). */
  warnings: string[];
  basis: PlanBasisDto;
}

/** The plan attached to an assignment: the request as given and the plan computed from it. */
export interface AssignmentPlanDto {
  request: PlannerRequest;
  plan: PlannerResponse;
  createdAt: string;
}
