/**
 * A demo wafer map: a ring-25 map of a boron-doped silicon wafer at three chuck temperatures,
 * with a resistivity that rises a few per cent toward the edge. Invented data for the demo only:
 * never a reference for tests of the physics.
 */
import {
  edgeCorrectionFactor,
  finiteThicknessFactor,
  patternSiteMm,
  resistivity,
  seededNormal,
  seededRandom,
  SITE_PATTERNS,
  THIN_SHEET_FACTOR,
} from '@rhotrace/physics';

/** The demo map upload: where it goes and how it was "measured". */
export interface DemoMap {
  lotCode: string;
  waferNumber: string;
  station: string;
  fileName: string;
  spacingCm: number;
  thicknessCm: number;
  diameterCm: number;
  sitePattern: 'ring-25';
  edgeExclusionMm: number;
  file: Buffer;
}

/** The demo map file, written as a probe station exports one site after another per set point. */
export function demoMap(): DemoMap {
  const spacingCm = 0.1;
  const thicknessCm = 0.0525;
  const diameterCm = 10;
  const edgeExclusionMm = 3;
  const currentA = 1e-3;
  const normal = seededNormal(seededRandom(25));
  const radiusMm = (diameterCm * 10) / 2;
  const usableMm = radiusMm - edgeExclusionMm;
  const thickness = finiteThicknessFactor(thicknessCm / spacingCm);
  const lines = [
    '# Larkspur Vale demo map export (invented data)',
    '# station: Hot chuck South',
    'T (K),Site,V (mV),I (mA)',
  ];
  for (const setK of [296.15, 313.15, 333.15]) {
    const bulk = resistivity('Si', { donorDensity: 0, acceptorDensity: 1.1e15, acceptor: 'B' }, setK);
    for (const site of SITE_PATTERNS['ring-25']) {
      const { xMm, yMm } = patternSiteMm('ring-25', site.number, usableMm);
      const r = Math.hypot(xMm, yMm) / radiusMm;
      // A dished profile, 4 % higher at the edge, with a slight tilt along x.
      const rho = bulk * (1 + 0.04 * r * r + 0.005 * (xMm / radiusMm)) * (1 + 0.002 * normal());
      const tipMm = radiusMm - Math.hypot(xMm, yMm) - 1.5 * spacingCm * 10;
      const edge = edgeCorrectionFactor({ distanceCm: tipMm / 10, spacingCm });
      const voltageV = ((rho / (thicknessCm * thickness)) * edge * currentA) / THIN_SHEET_FACTOR;
      const measuredK = setK + 0.08 * normal();
      lines.push(
        `${measuredK.toFixed(2)},${site.number},${(voltageV * 1e3).toPrecision(6)},${(currentA * 1e3).toFixed(3)}`,
      );
    }
  }
  return {
    lotCode: 'LV-26-B014',
    waferNumber: 'W03',
    station: 'Hot chuck South',
    fileName: 'B014-03_map_ring25_296-333K.csv',
    spacingCm,
    thicknessCm,
    diameterCm,
    sitePattern: 'ring-25',
    edgeExclusionMm,
    file: Buffer.from(`${lines.join('\n')}\n`, 'utf8'),
  };
}
