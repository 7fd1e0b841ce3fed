import { TestBed } from '@angular/core/testing';
import { Session } from '../core/auth/session';
import {
  TemperatureUnitSetting,
  formatTemperature,
  formatTemperatureRange,
  toKelvin,
  toUnit,
} from './temperature-unit';

describe('temperature unit', () => {
  afterEach(() => {
    localStorage.clear();
    TestBed.inject(Session).end();
  });

  it('converts by 0 °C = 273.15 K and prints one format', () => {
    // The Celsius scale's definition (SI Brochure, 9th ed., 2019, section 2.3.1).
    expect(toUnit(273.15, 'C')).toBe(0);
    expect(toKelvin(-196, 'C')).toBeCloseTo(77.15, 10);
    expect(formatTemperature(293.15, 'C')).toBe('20.0 °C');
    expect(formatTemperature(96.414, 'K')).toBe('96.4 K');
    expect(formatTemperatureRange(450, 600, 'K')).toBe('450.0–600.0 K');
    expect(formatTemperature(null, 'K')).toBe('–');
  });

  it('is remembered per user in this browser', () => {
    const session = TestBed.inject(Session);
    const signIn = (id: number) =>
      session.start({
        token: 't',
        expiresAt: new Date(Date.now() + 3_600_000).toISOString(),
        user: { id, email: `u${id}@lab.example`, name: `U${id}`, role: 'physicist' },
      });
    signIn(1);
    const setting = TestBed.inject(TemperatureUnitSetting);
    TestBed.tick();
    expect(setting.unit()).toBe('K');
    setting.set('C');
    signIn(2);
    TestBed.tick();
    expect(setting.unit()).toBe('K'); // another user keeps their own
    signIn(1);
    TestBed.tick();
    expect(setting.unit()).toBe('C');
  });
});
