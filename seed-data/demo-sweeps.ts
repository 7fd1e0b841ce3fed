/**
 * Demo sweeps, synthesised from the model with seeded noise and written in the shapes probe
 * stations export. Invented data for the demo only: never a reference for tests of the physics.
 */
import {
  celsiusToKelvin,
  fourPointProbe,
  kelvinToCelsius,
  metalResistivity,
  resistivity,
  seededNormal,
  seededRandom,
  type Doping,
  type SemiconductorId,
} from '@rhotrace/physics';

export interface DemoSweep {
  lotCode: string;
  waferNumber: string;
  station: string;
  fileName: string;
  /** Probe spacing and thickness the file was "measured" with. */
  spacingCm: number;
  thicknessCm: number;
  diameterCm: number;
  file: Buffer;
}

interface Recipe {
  lotCode: string;
  waferNumber: string;
  station: string;
  fileName: string;
  spacingCm: number;
  thicknessCm: number;
  diameterCm: number;
  temperaturesK: number[];
  resistivityAt: (temperatureK: number) => number;
  currentA: number;
  shape: 'comma-kelvin' | 'semicolon-celsius';
  seed: number;
  noise: number;
}

const range = (fromK: number, toK: number, stepK: number) =>
  Array.from({ length: Math.floor((toK - fromK) / stepK) + 1 }, (_, i) => fromK + i * stepK);

const semiconductor = (material: SemiconductorId, doping: Doping) => (t: number) =>
  resistivity(material, doping, t);

const RECIPES: Recipe[] = [
  {
    lotCode: 'LV-26-B014', waferNumber: 'W01', station: 'Cryo bench North', fileName: 'B014-01_cryo_25-480K.csv',
    spacingCm: 0.1, thicknessCm: 0.0524, diameterCm: 10, temperaturesK: range(25, 480, 5),
    resistivityAt: semiconductor('Si', { donorDensity: 0, acceptorDensity: 1.35e15, acceptor: 'B' }),
    currentA: 1e-3, shape: 'comma-kelvin', seed: 14, noise: 0.004,
  },
  {
    lotCode: 'LV-26-B014', waferNumber: 'W02', station: 'Cryo bench North', fileName: 'B014-02_cryo_250-420K.csv',
    spacingCm: 0.1, thicknessCm: 0.0527, diameterCm: 10, temperaturesK: range(250, 420, 5),
    resistivityAt: semiconductor('Si', { donorDensity: 0, acceptorDensity: 0.95e15, acceptor: 'B' }),
    currentA: 1e-3, shape: 'comma-kelvin', seed: 15, noise: 0.004,
  },
  {
    lotCode: 'LV-26-P021', waferNumber: 'W01', station: 'Hot chuck South', fileName: 'P021-01_hot_25-425C.csv',
    spacingCm: 0.1588, thicknessCm: 0.0523, diameterCm: 10, temperaturesK: range(298.15, 698.15, 5),
    resistivityAt: semiconductor('Si', { donorDensity: 1.6e15, acceptorDensity: 2e13, donor: 'P' }),
    currentA: 5e-3, shape: 'semicolon-celsius', seed: 21, noise: 0.005,
  },
  {
    lotCode: 'LV-26-G003', waferNumber: 'W01', station: 'Cryo bench North', fileName: 'G003-01_cryo_200-450K.csv',
    spacingCm: 0.1, thicknessCm: 0.0498, diameterCm: 5.08, temperaturesK: range(200, 450, 5),
    resistivityAt: semiconductor('Ge', { donorDensity: 0, acceptorDensity: 2e15, acceptor: 'Ga' }),
    currentA: 1e-3, shape: 'comma-kelvin', seed: 3, noise: 0.005,
  },
  {
    lotCode: 'LV-26-W007', waferNumber: 'W01', station: 'Hot chuck South', fileName: 'W007-01_film_20-120C.csv',
    spacingCm: 0.1588, thicknessCm: 0.0000198, diameterCm: 10, temperaturesK: range(293.15, 393.15, 2.5),
    resistivityAt: (t) => 1.9 * metalResistivity('W', t),
    currentA: 1e-3, shape: 'semicolon-celsius', seed: 7, noise: 0.002,
  },
];

/** The demo sweep files, identical on every run (seeded noise). */
export function demoSweeps(): DemoSweep[] {
  return RECIPES.map((r) => {
    const normal = seededNormal(seededRandom(r.seed));
    // resistivity per volt-per-ampere of this geometry, so V follows from the wanted resistivity
    const perVoltPerAmp = fourPointProbe({
      voltageV: 1, currentA: 1, spacingCm: r.spacingCm, thicknessCm: r.thicknessCm, diameterCm: r.diameterCm,
    }).resistivityOhmCm;
    const rows = r.temperaturesK.map((t) => {
      const measuredK = t + 0.05 * normal();
      const voltageV = (r.resistivityAt(t) * (1 + r.noise * normal()) * r.currentA) / perVoltPerAmp;
      return { measuredK, voltageV };
    });
    let text: string;
    if (r.shape === 'comma-kelvin') {
      text = [
        '# Larkspur Vale demo export (invented data)',
        `# station: ${r.station}`,
        'T (K),V (mV),I (mA)',
        ...rows.map((p) => `${p.measuredK.toFixed(2)},${(p.voltageV * 1e3).toPrecision(6)},${(r.currentA * 1e3).toFixed(3)}`),
      ].join('\n');
    } else {
      const comma = (x: string) => x.replace('.', ',');
      text = [
        `Station: ${r.station}`,
        `Operator: demo`,
        '',
        'T (°C);V (mV);I (mA)',
        ...rows.map(
          (p) =>
            `${comma(kelvinToCelsius(p.measuredK).toFixed(2))};${comma((p.voltageV * 1e3).toPrecision(6))};${comma((r.currentA * 1e3).toFixed(3))}`,
        ),
      ].join('\r\n');
    }
    return {
      lotCode: r.lotCode, waferNumber: r.waferNumber, station: r.station, fileName: r.fileName,
      spacingCm: r.spacingCm, thicknessCm: r.thicknessCm, diameterCm: r.diameterCm, file: Buffer.from(`${text}\n`, 'utf8'),
    };
  });
}

/** Kept so the °C helper stays the library's, not a copy. */
export const DEMO_ROOM_TEMPERATURE_K = celsiusToKelvin(23);
