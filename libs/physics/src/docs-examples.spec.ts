import { describe, expect, it } from 'vitest';
import * as physics from './index';

// Each check repeats an @example or a documented default of the JSDoc, so the docs cannot drift.
describe('documented examples and defaults', () => {
  const n15 = { donorDensity: 1e15, acceptorDensity: 0 };
  it('semiconductor examples hold', () => {
    expect(physics.bandGap('Si', 300)).toBeCloseTo(1.1245, 4);
    expect(physics.densityOfStates('Si', 300).conduction).toBeCloseTo(2.69e19, -15);
    expect(physics.intrinsicDensity('Si', 300) / 1.0038e10).toBeCloseTo(1, 4);
    const c = physics.carrierDensities('Si', n15, 300);
    expect(c.electrons / 1e15).toBeCloseTo(1, 2);
    expect(c.holes / 1e5).toBeCloseTo(1, 1);
    expect(physics.mobility('Si', 'electron', 300, 1e17)).toBeCloseTo(777.4, 1);
    expect(physics.resistivity('Si', n15, 300)).toBeCloseTo(4.72, 2);
    expect(physics.modelCurve('Si', n15, [300])[0]!.regime).toBe('extrinsic');
    const b = physics.regimeBoundaries('Si', n15);
    expect(b.freezeOutBelowK!).toBeCloseTo(87.5, 1);
    expect(b.intrinsicAboveK!).toBeCloseTo(547.0, 1);
  });
  it('probe, thermometry and conversion examples hold', () => {
    expect(physics.finiteThicknessFactor(1)).toBeCloseTo(0.9215, 4);
    expect(physics.circularSliceFactor(10)).toBeCloseTo(4.1712, 4);
    expect(physics.reciprocityDifference(100, 103)).toBeCloseTo(0.029557, 6);
    const fpp = physics.fourPointProbe({
      voltageV: 0.01,
      currentA: 0.001,
      spacingCm: 0.1,
      thicknessCm: 0.05,
    });
    expect(fpp.sheetResistanceOhmSq).toBeCloseTo(45.324, 3);
    expect(fpp.resistivityOhmCm).toBeCloseTo(2.2602, 4);
    expect(fpp.thicknessFactor).toBeCloseTo(0.99736, 5);
    expect(
      physics.vanDerPauw({ resistanceAOhm: 10, resistanceBOhm: 10 }).sheetResistanceOhmSq,
    ).toBeCloseTo(45.324, 3);
    expect(
      physics.barResistivity({
        voltageV: 0.5,
        currentA: 0.001,
        lengthCm: 1,
        widthCm: 0.2,
        thicknessCm: 0.05,
      }),
    ).toBeCloseTo(5, 12);
    expect(physics.rtdResistance(373.15)).toBeCloseTo(138.5055, 4);
    expect(physics.rtdTemperatureK(138.5055)).toBeCloseTo(373.15, 6);
    expect(physics.thermocoupleEmfMv('K', 373.15)).toBeCloseTo(4.096, 3);
    expect(physics.thermocoupleTemperatureK('K', 1.0, 296.15)).toBeCloseTo(320.63, 2);
    const table = [
      { reading: 1, temperatureK: 10 },
      { reading: 2, temperatureK: 20 },
    ];
    expect(physics.calibrationTableTemperatureK(table, 1.5)).toBeCloseTo(15, 9);
    expect(physics.siliconResistivityFromDopant('boron', 1e16)).toBeCloseTo(1.4434, 4);
    expect(physics.siliconDopantFromResistivity('phosphorus', 1) / 4.864e15).toBeCloseTo(1, 3);
    expect(physics.celsiusToKelvin(23)).toBeCloseTo(296.15, 12);
    expect(physics.kelvinToCelsius(373.15)).toBeCloseTo(100, 12);
  });
  it('planner examples hold', () => {
    const steps = physics.planTemperatureSteps({
      minK: 20,
      maxK: 100,
      count: 10,
      spacing: 'inverse',
    });
    expect(steps[1]).toBeCloseTo(21.95, 2);
    expect(steps[8]).toBeCloseTo(69.23, 2);
    expect(physics.denseAround([100, 200, 300], [150])).toEqual([
      100, 135, 142.5, 157.5, 165, 200, 300,
    ]);
    expect(physics.sweepDurationS([296.15, 306.15], { dwellS: 60, rampKPerMin: 5 })).toBeCloseTo(
      360,
      9,
    );
    const p = physics.planProbeCurrent({
      method: 'four-point',
      sheetResistanceOhmSq: 100,
      targetVoltageV: 0.01,
      maxVoltageV: 0.1,
      maxPowerW: 0.01,
    });
    expect(p.currentA).toBeCloseTo(4.532e-4, 7);
    expect(p.powerW).toBeCloseTo(4.532e-6, 9);
    expect(p.limitedBy).toBe('target-voltage');
    const ranges = physics.planCurrentRanges([100, 150], {
      method: 'van-der-pauw',
      targetVoltageV: 0.01,
      maxVoltageV: 0.1,
      maxPowerW: 0.01,
    });
    expect(ranges.ranges).toHaveLength(1);
  });
  it('fit and metal examples hold', () => {
    expect(physics.studentTCritical(0.95, 10)).toBeCloseTo(2.2281, 4);
    expect(physics.seededRandom(42)()).toBeCloseTo(0.6011, 4);
    expect(physics.blochGruneisenJ5(1)).toBeCloseTo(0.2366, 4);
    expect(
      physics.blochGruneisen(343, { residualOhmCm: 0, couplingOhmCm: 1e-5, debyeK: 343 }),
    ).toBeCloseTo(2.366e-6, 9);
    expect(physics.metalResistivity('Cu', 293.15)).toBeCloseTo(1.68e-6, 15);
    const r = physics.interpretArrheniusSlope({
      activationEnergyEv: 0.6,
      regime: 'intrinsic',
      material: 'Si',
    });
    expect(r.impliedEv).toBeCloseTo(1.2, 12);
    expect(physics.listMaterials().semiconductors[0]!.id).toBe('Si');
  });
  it('functions use the documented defaults', () => {
    const d = physics.PHYSICS_DEFAULTS;
    expect(physics.rtdResistance(373.15)).toBe(physics.rtdResistance(373.15, d.rtdR0Ohm));
    const pts = [280, 293.15, 310, 330].map((t) => ({
      temperatureK: t,
      resistivityOhmCm: 1e-6 * (1 + 0.004 * (t - 293.15)),
    }));
    expect(physics.fitLinearTcr(pts).parameters.referenceResistivityOhmCm).toBeCloseTo(1e-6, 15);
    expect(d.tcrReferenceK).toBe(293.15);
    const ap = [300, 350, 400].map((t) => ({
      temperatureK: t,
      value: Math.exp(0.1 / (physics.BOLTZMANN_EV_PER_K * t)),
    }));
    expect(physics.fitArrhenius(ap)).toEqual(
      physics.fitArrhenius(ap, {
        quantity: d.arrheniusQuantity,
        prefactorExponent: d.arrheniusPrefactorExponent,
        stepToleranceK: d.fitStepToleranceK,
        temperatureUncertaintyK: d.fitTemperatureUncertaintyK,
      }),
    );
    // A documented default that differs from the code fails here: 0.4 K apart is one step.
    const close = [300, 300.4, 350, 400].map((t) => ({ temperatureK: t, value: t }));
    expect(physics.fitArrhenius(close).stepCount).toBe(3);
    expect(physics.fitArrhenius(close, { stepToleranceK: 0.3 }).stepCount).toBe(4);
    expect(physics.resistivity('Si', n15, 300)).toBe(
      physics.resistivity('Si', n15, 300, {
        densityOfStatesSet: d.densityOfStatesSet.Si,
        mobilityModel: d.mobilityModel.Si,
      }),
    );
    expect(physics.resistivity('Si', n15, 300)).not.toBe(
      physics.resistivity('Si', n15, 300, { densityOfStatesSet: 'si-green-1990' }),
    );
    expect(d.donorDegeneracy).toBe(2);
    expect(d.acceptorDegeneracy).toBe(4);
  });
});

describe('documented Hall examples', () => {
  it('hall examples hold', () => {
    expect(
      physics.hallVoltageFromReversals({ pp: 0.0012, pn: -0.0008, np: 0.0032, nn: -0.0028 }),
    ).toBeCloseTo(-0.001, 15);
    const h = physics.hallCoefficient({
      hallVoltageV: -1e-3,
      currentA: 1e-3,
      magneticFieldT: 0.5,
      thicknessCm: 0.05,
    });
    expect(h.hallCoefficientCm3PerC).toBeCloseTo(-1000, 9);
    expect(h.densityCm3 / 6.24e15).toBeCloseTo(1, 2);
    expect(h.carrierType).toBe('n');
    expect(physics.hallMobility(-1000, 1)).toBe(1000);
    expect(
      physics.twoCarrierHallCoefficient({
        electronDensityCm3: 1e15,
        holeDensityCm3: 1e15,
        electronMobility: 3,
        holeMobility: 1,
      }),
    ).toBeCloseTo(-3121, 0);
    const mu = physics.fitMobilityPowerLaw(
      [100, 150, 200, 300].map((t) => ({ temperatureK: t, mobility: 1000 * (t / 300) ** -2.4 })),
    );
    expect(mu.exponent).toBeCloseTo(-2.4, 9);
  });
});
