import { THERMOCOUPLE_LETTERS } from '@rhotrace/api-types';
import { THERMOCOUPLE_TYPES } from '@rhotrace/physics';
import { describe, expect, it } from 'vitest';
import { parseSweepFile } from '../parse';
import { readTemperatureK } from '../parse/metadata';
import { temperatureReader } from './temperature';

describe('temperature conversion', () => {
  it('lists the same thermocouple types as the physics library', () => {
    expect([...THERMOCOUPLE_LETTERS]).toEqual([...THERMOCOUPLE_TYPES]);
  });

  it('reads cold-junction lines in °C or K and refuses a bare number', () => {
    expect(readTemperatureK('23.4 °C')).toBeCloseTo(296.55, 9);
    expect(readTemperatureK('23,4 C')).toBeCloseTo(296.55, 9);
    expect(readTemperatureK('296.55 K')).toBeCloseTo(296.55, 9);
    expect(readTemperatureK('23.4')).toBeUndefined();
  });

  it('prefers the file type and junction over the station sensor, and says so', () => {
    const parsed = parseSweepFile(
      Buffer.from('# Thermocouple type: type j\n# CJC: 0 °C\nTC (mV),I (mA),V (mV)\n1,1,10\n'),
    );
    const reader = temperatureReader({
      column: parsed.columns[0]!,
      referenceColumn: false,
      sensor: { kind: 'thermocouple', type: 'K', referenceJunctionK: 296.15 },
      file: parsed.recognised,
      geometry: {},
    });
    expect(reader.conversion.description).toMatch(
      /^type J thermocouple \(file\).*0\.00 °C \(file metadata\)/,
    );
    // NIST J table (issue 15 check value, from memory): 5.269 mV at 100 °C against 0 °C
    expect(Math.abs(reader.toKelvin(0.005269, null) - 373.15)).toBeLessThan(0.03);
  });

  it('refuses a voltage column without a thermocouple type, naming the metadata line', () => {
    const parsed = parseSweepFile(Buffer.from('TC (mV),I (mA),V (mV)\n1,1,10\n'));
    expect(() =>
      temperatureReader({
        column: parsed.columns[0]!,
        referenceColumn: false,
        sensor: null,
        file: parsed.recognised,
        geometry: {},
      }),
    ).toThrow(/The temperature column cannot be converted/);
  });
});
