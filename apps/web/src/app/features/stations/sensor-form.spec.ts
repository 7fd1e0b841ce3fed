import type { StationDto } from '@rhotrace/api-types';
import { parseCalibrationTable, sensorFormValues, sensorOf, sensorWords } from './sensor-form';

describe('parseCalibrationTable', () => {
  it('reads two columns split by tabs, commas, semicolons or spaces, skipping a header', () => {
    const text = 'reading (V)\tT (K)\n1.10\t20\n1.0, 100\n\n0.5;300\n0.3 400\n';
    expect(parseCalibrationTable(text)).toEqual({
      points: [
        { reading: 1.1, temperatureK: 20 },
        { reading: 1.0, temperatureK: 100 },
        { reading: 0.5, temperatureK: 300 },
        { reading: 0.3, temperatureK: 400 },
      ],
    });
  });

  it.each([
    ['1.1\t20\n1.0\t100', 'A calibration table needs at least 3 rows (2 given)'],
    ['1.1\t20\n1.0\n0.5\t300', 'Row 2: give two values, a reading and a temperature in K'],
    ['1.1\t20\n1.0\tabc\n0.5\t300', 'Row 2: “abc” is not a number'],
    ['1.1\t20\n1.0\t-4\n0.5\t300', 'Row 2: the temperature must be above 0 K (-4)'],
    [
      '1.1\t20\n1.0\t100\n1.0\t300',
      "Row 3: the reading 1 repeats row 2's; each reading must differ",
    ],
    [
      '1.1\t20\n1.0\t100\n1.05\t300',
      'Row 3: the reading 1.05 breaks the order of the rows above (they fall); sort the table by reading',
    ],
    [
      '1.1\t20\n1.0\t100\n0.5\t90',
      'Row 3: the temperature 90 K does not rise with the reading as in the rows above; the temperature must run one way with the reading',
    ],
  ])('refuses %j: %s', (text, problem) => {
    expect(parseCalibrationTable(text)).toEqual({ problem });
  });
});

describe('sensor fields', () => {
  const values = { r0Ohm: 100, type: 'K' as const, referenceJunctionC: 23.4, points: '' };

  it('sends the sensor of the chosen thermometer only', () => {
    expect(sensorOf('platinum-rtd', values)).toEqual({ kind: 'platinum-rtd', r0Ohm: 100 });
    const tc = sensorOf('thermocouple', values);
    expect(tc.kind === 'thermocouple' && tc.type).toBe('K');
    // 23.4 °C = 296.55 K (ITS-90: T/K = t/°C + 273.15)
    expect(tc.kind === 'thermocouple' && tc.referenceJunctionK).toBeCloseTo(296.55, 9);
    expect(sensorOf('thermocouple', { ...values, type: '', referenceJunctionC: null })).toEqual({
      kind: 'thermocouple',
      type: null,
      referenceJunctionK: null,
    });
    expect(sensorOf('table', { ...values, points: '2\t10\n1\t20\n0.5\t40' })).toEqual({
      kind: 'table',
      points: [
        { reading: 2, temperatureK: 10 },
        { reading: 1, temperatureK: 20 },
        { reading: 0.5, temperatureK: 40 },
      ],
    });
  });

  it('shows a stored sensor in the form and in words', () => {
    const station = {
      thermometer: 'thermocouple',
      rtdR0Ohm: null,
      sensor: { kind: 'thermocouple', type: 'T', referenceJunctionK: 296.55 },
    } as StationDto;
    expect(sensorFormValues(station)).toEqual({
      r0Ohm: null,
      type: 'T',
      referenceJunctionC: 23.4,
      points: '',
    });
    expect(sensorWords(station)).toBe('Type T thermocouple, cold junction 23.4 °C');
  });
});
