import { describe, expect, it } from 'vitest';
import {
  barResistivity,
  celsiusToKelvin,
  fourPointProbe,
  PhysicsInputError,
  PhysicsTypeError,
  rtdTemperatureK,
  vanDerPauw,
} from './index';

/** The error a call throws (the test fails when it throws nothing). */
function thrown(call: () => unknown): unknown {
  try {
    call();
  } catch (error) {
    return error;
  }
  throw new Error('expected the call to throw');
}

const probe = { voltageV: 0.01, currentA: 0.001, spacingCm: 0.1, thicknessCm: 0.05 };

describe('typed input errors', () => {
  it.each([
    [
      'a diameter under three spacings',
      () => fourPointProbe({ ...probe, diameterCm: 0.2 }),
      'fourPointProbe',
      'diameterCm',
      '`fourPointProbe` requires diameterCm of at least 3 probe spacings (0.30000000000000004 cm), got 0.2',
    ],
    [
      'V and I of opposite signs',
      () => fourPointProbe({ ...probe, voltageV: -0.01 }),
      'fourPointProbe',
      'voltageV and currentA',
      '`fourPointProbe` requires voltageV and currentA of the same sign and non-zero, got -0.01 V and 0.001 A',
    ],
    [
      'a zero current',
      () => barResistivity({ ...probe, currentA: 0, lengthCm: 1, widthCm: 0.1 }),
      'barResistivity',
      'currentA',
      '`barResistivity` requires a non-zero currentA, got 0',
    ],
    [
      'a negative thickness (checked in validate.ts)',
      () => vanDerPauw({ resistanceAOhm: 1, resistanceBOhm: 1, thicknessCm: -1 }),
      'vanDerPauw',
      'thicknessCm',
      '`vanDerPauw` requires thicknessCm above 0, got -1',
    ],
    [
      'a resistance ratio beyond 1e12',
      () => vanDerPauw({ resistanceAOhm: 1e13, resistanceBOhm: 1 }),
      'vanDerPauw',
      'resistanceAOhm and resistanceBOhm',
      '`vanDerPauw` requires resistanceAOhm / resistanceBOhm between 1e-12 and 1e12, got 10000000000000',
    ],
    [
      'a temperature below absolute zero',
      () => celsiusToKelvin(-300),
      'celsiusToKelvin',
      'temperatureCelsius',
      '`celsiusToKelvin` requires temperatureCelsius of at least -273.15, got -300',
    ],
    [
      'an RTD reading outside IEC 60751',
      () => rtdTemperatureK(5),
      'rtdTemperatureK',
      'resistanceOhm',
      '`rtdTemperatureK` requires a resistance (resistanceOhm) between 18.52008 and 390.4811 ohm for R0 = 100 ohm, got 5',
    ],
  ])('%s: a PhysicsInputError naming the function and argument', (_, call, fn, arg, message) => {
    const error = thrown(call);
    expect(error).toBeInstanceOf(PhysicsInputError);
    expect(error).toBeInstanceOf(RangeError);
    expect(error).toMatchObject({ functionName: fn, argument: arg, message });
    expect((error as PhysicsInputError).requirement).toBe(message.slice(fn.length + 3));
  });

  it('a value of the wrong kind is a PhysicsTypeError, still a TypeError', () => {
    const error = thrown(() => fourPointProbe({ ...probe, voltageV: '1' as unknown as number }));
    expect(error).toBeInstanceOf(PhysicsTypeError);
    expect(error).toBeInstanceOf(TypeError);
    expect(error).toMatchObject({
      functionName: 'fourPointProbe',
      argument: 'voltageV',
      message: '`fourPointProbe` requires voltageV to be a number, got "1"',
    });
  });
});
