import {
  alsoShownText,
  formatDay,
  formatLength,
  formatStamp,
  formatValue,
  geometryWords,
} from './format';

describe('formatValue', () => {
  it('uses a power of ten for extremes', () => {
    expect(formatValue(1.5e16, 3)).toBe('1.50 × 10¹⁶');
  });
});

describe('lengths in the units a lab writes', () => {
  it('shows thickness in µm and diameter and probe spacing in mm', () => {
    // 1 cm = 10 mm = 10⁴ µm (SI prefixes).
    expect(formatLength(0.0525, 'thicknessCm')).toBe('525 µm');
    expect(formatLength(0.0025, 'thicknessToleranceCm')).toBe('25 µm');
    expect(formatLength(15, 'diameterCm')).toBe('150 mm');
    expect(formatLength(0.159, 'probeSpacingCm')).toBe('1.59 mm');
    expect(formatLength(0.004, 'tipRadiusCm')).toBe('40 µm');
    expect(formatLength(null, 'thicknessCm')).toBe('–');
  });
});

describe('dates and instants', () => {
  it('writes days as YYYY-MM-DD and instants to the minute in UTC, the zone stated', () => {
    expect(formatDay('2026-12-05')).toBe('2026-12-05');
    expect(formatDay('2026-12-05T23:30:00.000Z')).toBe('2026-12-05');
    expect(formatDay(null)).toBe('–');
    expect(formatStamp('2026-12-05T09:18:42.123Z')).toBe('2026-12-05 09:18 UTC');
    // An offset is turned into UTC, not dropped: 01:30 at +02:00 is 23:30 UTC the day before.
    expect(formatStamp('2026-12-06T01:30:00+02:00')).toBe('2026-12-05 23:30 UTC');
  });
});

describe('TCR in ppm/K beside 1/K', () => {
  it('gives the temperature coefficient a second unit, and no other parameter', () => {
    // 1 ppm/K = 10⁻⁶ 1/K; copper's 0.00393 1/K (CRC Handbook, from memory) is 3930 ppm/K.
    expect(alsoShownText('alphaPerK', 0.00393)).toBe(' (3930 ppm/K)');
    expect(alsoShownText('alphaPerK', 2.1e-5, 2)).toBe(' (21 ppm/K)');
    expect(alsoShownText('activationEnergyEv', 0.045)).toBe('');
    expect(alsoShownText('alphaPerK', null)).toBe('');
  });
});

describe('geometryWords', () => {
  it('names each value with its lab unit and where it came from', () => {
    expect(
      geometryWords({
        thicknessCm: 0.0524,
        spacingCm: 0.1588,
        rtdR0Ohm: 100,
        sources: { thicknessCm: 'wafer', spacingCm: 'station', rtdR0Ohm: 'station' },
      }),
    ).toBe(
      'thickness 524 µm from the wafer · probe spacing 1.588 mm from the station · ' +
        'thermometer R0 100 Ω from the station',
    );
  });

  it('is empty when nothing was recorded, and leaves a value without source unlabelled', () => {
    expect(geometryWords({ sources: {} })).toBe('');
    expect(geometryWords({ barWidthCm: 0.2, sources: {} })).toBe('bar width 2 mm');
  });
});
