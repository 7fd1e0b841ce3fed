/**
 * The demo scenario: an invented university microfabrication lab. Every name, lot code,
 * supplier and address here is fictional; e-mail addresses use the reserved `.example` domain.
 */
import type { AssignmentState, Material, Role, Thermometer, WaferState } from '@rhotrace/api-types';

/** Password of every demo account (demo only; never used when NODE_ENV=production). */
export const DEMO_PASSWORD = 'rhotrace-demo';

export const DEMO_LAB_NAME = 'Larkspur Vale Institute, Microfabrication Teaching Lab (fictional)';

export const DEMO_USERS: Array<{ email: string; name: string; role: Role }> = [
  { email: 'admin@rhotrace.example', name: 'Ada Quillfeather', role: 'admin' },
  { email: 'manager@rhotrace.example', name: 'Milo Brightwater', role: 'manager' },
  { email: 'engineer@rhotrace.example', name: 'Priya Tamberlane', role: 'engineer' },
  { email: 'physicist@rhotrace.example', name: 'Oskar Fennimore', role: 'physicist' },
  { email: 'technician@rhotrace.example', name: 'Juno Pebblestone', role: 'technician' },
  { email: 'student@rhotrace.example', name: 'Tavi Moonbrook', role: 'technician' },
];

export const DEMO_STATIONS: Array<{
  name: string;
  probeSpacingCm: number;
  tipRadiusCm: number;
  thermometer: Thermometer;
  rtdR0Ohm: number | null;
  minTemperatureK: number;
  maxTemperatureK: number;
  calibratedOn: string;
  /** +/- half-widths the 23 °C uncertainty budget reads (null: not stated). */
  probeSpacingToleranceCm: number | null;
  temperatureToleranceK: number | null;
  notes: string;
}> = [
  {
    name: 'Cryo bench North',
    probeSpacingCm: 0.1,
    tipRadiusCm: 0.004,
    thermometer: 'platinum-rtd',
    rtdR0Ohm: 100,
    minTemperatureK: 20,
    maxTemperatureK: 500,
    calibratedOn: '2026-09-14',
    probeSpacingToleranceCm: 0.0005,
    temperatureToleranceK: null,
    notes: 'Closed-cycle helium cryostat with a Pt100 under the sample; liquid-nitrogen pre-cool.',
  },
  {
    name: 'Hot chuck South',
    probeSpacingCm: 0.1588,
    tipRadiusCm: 0.005,
    thermometer: 'thermocouple',
    rtdR0Ohm: null,
    minTemperatureK: 290,
    maxTemperatureK: 720,
    calibratedOn: '2026-06-02',
    probeSpacingToleranceCm: null,
    temperatureToleranceK: null,
    notes: 'Type K thermocouple in the chuck; ramps to 450 °C.',
  },
];

interface DemoWafer {
  number: string;
  thicknessCm: number | null;
  state: WaferState;
  notes: string | null;
}

export const DEMO_LOTS: Array<{
  code: string;
  material: Material;
  dopant: string | null;
  dopantType: 'n' | 'p' | null;
  orientation: string | null;
  diameterCm: number;
  thicknessCm: number;
  /** +/- supplier thickness tolerance, cm; absent when the supplier states none. */
  thicknessToleranceCm?: number;
  supplier: string;
  receivedOn: string;
  specMinOhmCm: number | null;
  specMaxOhmCm: number | null;
  notes: string;
  wafers: DemoWafer[];
}> = [
  {
    code: 'LV-26-B014',
    material: 'Si',
    dopant: 'B',
    dopantType: 'p',
    orientation: '(100)',
    diameterCm: 10,
    thicknessCm: 0.0525,
    thicknessToleranceCm: 0.0025,
    supplier: 'Quarrystone Crystal Works (fictional)',
    receivedOn: '2026-10-06',
    specMinOhmCm: 8,
    specMaxOhmCm: 12,
    notes: 'Prime-grade p-type wafers for the diode teaching module.',
    wafers: [
      { number: 'W01', thicknessCm: 0.0524, state: 'measured', notes: null },
      { number: 'W02', thicknessCm: 0.0527, state: 'measured', notes: null },
      { number: 'W03', thicknessCm: null, state: 'queued', notes: null },
      { number: 'W04', thicknessCm: null, state: 'received', notes: 'Edge chip at the flat.' },
    ],
  },
  {
    code: 'LV-26-P021',
    material: 'Si',
    dopant: 'P',
    dopantType: 'n',
    orientation: '(100)',
    diameterCm: 10,
    thicknessCm: 0.0525,
    supplier: 'Harrowgate Silicon (fictional)',
    receivedOn: '2026-10-20',
    specMinOhmCm: 1,
    specMaxOhmCm: 5,
    notes: 'n-type substrates for the MOS capacitor lab.',
    wafers: [
      { number: 'W01', thicknessCm: 0.0523, state: 'measured', notes: null },
      { number: 'W02', thicknessCm: null, state: 'measuring', notes: null },
      { number: 'W03', thicknessCm: null, state: 'received', notes: null },
    ],
  },
  {
    code: 'LV-26-G003',
    material: 'Ge',
    dopant: 'Ga',
    dopantType: 'p',
    orientation: '(111)',
    diameterCm: 5.08,
    thicknessCm: 0.05,
    supplier: 'Fernhollow Materials (fictional)',
    receivedOn: '2026-08-30',
    specMinOhmCm: 0.5,
    specMaxOhmCm: 5,
    notes: 'Germanium for the band-gap exercise.',
    wafers: [
      { number: 'W01', thicknessCm: 0.0498, state: 'measured', notes: null },
      { number: 'W02', thicknessCm: null, state: 'received', notes: null },
    ],
  },
  {
    code: 'LV-26-A002',
    material: 'GaAs',
    dopant: 'Si',
    dopantType: 'n',
    orientation: '(100)',
    diameterCm: 5.08,
    thicknessCm: 0.035,
    supplier: 'Bramblecourt Compound Semis (fictional)',
    receivedOn: '2026-09-18',
    specMinOhmCm: 0.001,
    specMaxOhmCm: 0.01,
    notes: 'Gallium arsenide: toxic when broken or abraded; handle per the lab chemical-safety rules.',
    wafers: [{ number: 'W01', thicknessCm: null, state: 'received', notes: null }],
  },
  {
    code: 'LV-26-W007',
    material: 'W',
    dopant: null,
    dopantType: null,
    orientation: null,
    diameterCm: 10,
    thicknessCm: 0.00002,
    supplier: 'In-house sputter run 7',
    receivedOn: '2026-11-03',
    specMinOhmCm: 5e-6,
    specMaxOhmCm: 1.2e-5,
    notes: '200 nm tungsten on 1 µm thermal oxide, for the TCR exercise.',
    wafers: [
      { number: 'W01', thicknessCm: 0.0000198, state: 'measured', notes: null },
      { number: 'W02', thicknessCm: null, state: 'received', notes: null },
    ],
  },
];

export const DEMO_ASSIGNMENTS: Array<{
  lotCode: string;
  waferNumber: string;
  assignee: string;
  task: string;
  dueInDays: number;
  state: AssignmentState;
  notes: string | null;
}> = [
  {
    lotCode: 'LV-26-B014',
    waferNumber: 'W03',
    assignee: 'technician@rhotrace.example',
    task: 'Four-point sweep 80 K to 480 K on the cryo bench',
    dueInDays: 3,
    state: 'assigned',
    notes: 'Use 1 mA; pre-cool the chuck before loading.',
  },
  {
    lotCode: 'LV-26-P021',
    waferNumber: 'W02',
    assignee: 'technician@rhotrace.example',
    task: 'Four-point sweep 300 K to 700 K on the hot chuck',
    dueInDays: 1,
    state: 'in progress',
    notes: null,
  },
  {
    lotCode: 'LV-26-B014',
    waferNumber: 'W01',
    assignee: 'technician@rhotrace.example',
    task: 'Room-temperature spot check at 23 °C',
    dueInDays: -12,
    state: 'done',
    notes: null,
  },
  {
    lotCode: 'LV-26-G003',
    waferNumber: 'W02',
    assignee: 'student@rhotrace.example',
    task: 'Van der Pauw sweep 200 K to 400 K',
    dueInDays: -2,
    state: 'assigned',
    notes: 'Overdue: please book the cryo bench.',
  },
  {
    lotCode: 'LV-26-W007',
    waferNumber: 'W02',
    assignee: 'student@rhotrace.example',
    task: 'Metal film TCR sweep 290 K to 400 K, low current',
    dueInDays: 7,
    state: 'assigned',
    notes: 'Keep the probe current at or under 1 mA to avoid heating the film.',
  },
];
