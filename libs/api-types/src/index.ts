/**
 * The public API of @rhotrace/api-types: request and response types shared by the API and the
 * web app, the error shape, and the role-to-capability table. Named re-exports only.
 */
export { MAX_RECENT_LIMIT, DEFAULT_RECENT_LIMIT } from './activity';
export type {
  RecentSweepDto,
  RecentSweepsResponse,
  RecentFitDto,
  RecentFitsResponse,
} from './activity';
export type {
  RegimeName,
  DopingInput,
  ModelCurveRequest,
  SemiconductorCurvePoint,
  MetalCurvePoint,
  ModelCurveResponse,
  SourceDto,
  SemiconductorMaterialDto,
  MetalMaterialDto,
  MaterialsResponse,
  AnalysisSweepDto,
  AnalysisStep,
  ArrheniusPoint,
  SuggestedWindow,
  SpecCheckDto,
  SweepAnalysisResponse,
  FlaggedReadingDto,
  LegDto,
  DopantDensityResponse,
} from './analysis';
export { ROLES, MIN_PASSWORD_LENGTH, USER_SORT_FIELDS } from './auth';
export type {
  Role,
  UserDto,
  SessionUser,
  LoginRequest,
  LoginResponse,
  PasswordResetRequest,
  PasswordResetConfirm,
  CreateUserRequest,
  UpdateUserRequest,
  PasswordResetAccepted,
  UserListQuery,
  AssigneeDto,
} from './auth';
export { CAPABILITIES, ROLE_CAPABILITIES, roleCan, rolesWith } from './capabilities';
export type { Capability } from './capabilities';
export { MAX_PAGE_SIZE, DEFAULT_PAGE_SIZE } from './common';
export type { Page, HealthResponse } from './common';
export { ERROR_STATUS } from './errors';
export type { FieldProblem, ApiErrorBody, ErrorCode } from './errors';
export { PARAMETER_WORDS, KIND_WORDS } from './fit-words';
export { FIT_KINDS, FIT_EXCLUDED_FLAGS } from './fits';
export type {
  FitKind,
  FitRequestOptions,
  FitRequest,
  FitCorrelation,
  FitGoodness,
  FitInterpretation,
  HallScattering,
  FitCurvature,
  FitDto,
  FitPreviewDto,
} from './fits';
export type { HallAnalysisStep, HallAnalysis, HallAt300K } from './hall';
export {
  LENGTH_UNIT_OF,
  GEOMETRY_LABELS,
  GEOMETRY_SOURCE_WORDS,
  cmToLength,
  lengthToCm,
  ALSO_SHOWN_IN,
  alsoShownIn,
  isoDay,
  isoStampUtc,
} from './lab-units';
export type { LengthUnit } from './lab-units';
export type { LotSummaryWafer, LotSummaryResponse, CompareResponse } from './lot-summary';
export { MAP_CORRECTIONS, DEFAULT_EDGE_EXCLUSION_MM } from './maps';
export type {
  MapCorrection,
  SweepMapInput,
  SweepMapInfo,
  MapSiteDto,
  MapStatisticsDto,
  MapAtTemperatureDto,
  PatternSiteDto,
  SweepMapResponse,
  LotWaferMapDto,
  LotMapsResponse,
  WaferUniformity,
  LotUniformitySpread,
} from './maps';
export { PLAN_SPACINGS, PLAN_METHODS, CURRENT_LIMITS } from './planner';
export type {
  PlanSpacing,
  PlanMethodName,
  CurrentLimitName,
  PlannerRequest,
  PlanStepDto,
  PlanCurrentRangeDto,
  PlanBasisDto,
  PlannerResponse,
  AssignmentPlanDto,
} from './planner';
export {
  SEMICONDUCTORS,
  METAL_FILMS,
  MATERIALS,
  WAFER_STATES,
  ASSIGNMENT_STATES,
  THERMOMETERS,
  THERMOCOUPLE_LETTERS,
  CALIBRATION_TABLE_MIN_POINTS,
  LOT_SORT_FIELDS,
  WAFER_SORT_FIELDS,
  STATION_SORT_FIELDS,
  ASSIGNMENT_SORT_FIELDS,
} from './records';
export type {
  Material,
  WaferState,
  AssignmentState,
  Thermometer,
  ThermocoupleLetter,
  StationSensor,
  LotDto,
  LotInput,
  WaferDto,
  StationDto,
  AssignmentDto,
  AuditChangeDto,
  AssignmentSweepDto,
  AssignmentStationUpload,
  AuditEventDto,
  LotListQuery,
  WaferListQuery,
  AssignmentListQuery,
  WaferInput,
  StationInput,
  CreateAssignmentRequest,
  UpdateAssignmentRequest,
  AuditListQuery,
} from './records';
export { SEARCH_KINDS } from './search';
export type { SearchKind, SearchHit, SearchGroup, SearchResponse } from './search';
export { UNCERTAINTY_SOURCES, SPEC_VERDICT_WORDS, SPEC_VERDICT_MEANINGS } from './spec';
export type {
  ValueAt23CMethod,
  SpecVerdict,
  UncertaintySource,
  UncertaintyContribution,
  ValueUncertainty,
  LotCapability,
} from './spec';
export { STATION_TOKEN_PREFIX } from './station-tokens';
export type {
  CreateStationTokenRequest,
  StationTokenDto,
  StationTokenCreatedResponse,
  StationUploadDto,
  StationSweepCreatedResponse,
} from './station-tokens';
export type {
  PreviewRow,
  SweepPreviewResponse,
  MetadataFinding,
  SweepLayoutInput,
  ImportSettingsDto,
  ImportSettingsInput,
} from './sweep-preview';
export {
  SWEEP_METHODS,
  METHOD_WORDS,
  COLUMN_MEANINGS,
  POINT_FLAGS,
  JUMP_FACTOR,
  MAX_FINDINGS,
  HALL_FACTOR_NAMES,
} from './sweeps';
export type {
  SweepMethod,
  ColumnMeaning,
  PointFlag,
  SweepColumn,
  RowProblem,
  SweepColumnOverride,
  SweepGeometryInput,
  GeometrySource,
  SweepGeometry,
  SweepCreatedResponse,
  SweepSummaryDto,
  PointFinding,
  TemperatureConversion,
  SweepParseReport,
  RawReading,
  SweepPointDto,
  PointQuantities,
  HallFactorName,
  HallImportReport,
  SweepSite,
  SweepDto,
} from './sweeps';
