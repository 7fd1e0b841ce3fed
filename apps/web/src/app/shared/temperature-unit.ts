import { Injectable, computed, effect, inject, signal, untracked } from '@angular/core';
import { ZERO_CELSIUS_K } from '@rhotrace/physics';
import { Session } from '../core/auth/session';

/** The unit temperatures are shown and typed in. Stored values stay in kelvin. */
export type TemperatureUnit = 'K' | 'C';

/** The unit's symbol as printed after a value. */
export const UNIT_SYMBOL: Readonly<Record<TemperatureUnit, string>> = { K: 'K', C: '°C' };

/** A temperature in kelvin expressed in `unit`. */
export function toUnit(temperatureK: number, unit: TemperatureUnit): number {
  return unit === 'K' ? temperatureK : temperatureK - ZERO_CELSIUS_K;
}

/** A temperature typed in `unit`, in kelvin. */
export function toKelvin(value: number, unit: TemperatureUnit): number {
  return unit === 'K' ? value : value + ZERO_CELSIUS_K;
}

/**
 * The one format of a temperature on screen: 0.1 of a degree, then the unit ("450.0 K",
 * "176.9 °C"); a missing value is a dash.
 */
export function formatTemperature(
  temperatureK: number | null | undefined,
  unit: TemperatureUnit,
): string {
  if (temperatureK === null || temperatureK === undefined || !Number.isFinite(temperatureK))
    return '–';
  return `${toUnit(temperatureK, unit).toFixed(1)} ${UNIT_SYMBOL[unit]}`;
}

/** A temperature range in the one format, the unit once: "450.0–600.0 K". */
export function formatTemperatureRange(
  minK: number | null | undefined,
  maxK: number | null | undefined,
  unit: TemperatureUnit,
): string {
  if (minK === null || minK === undefined || maxK === null || maxK === undefined) return '–';
  return `${toUnit(minK, unit).toFixed(1)}–${toUnit(maxK, unit).toFixed(1)} ${UNIT_SYMBOL[unit]}`;
}

const KEY_PREFIX = 'rhotrace.temperature-unit.';

/**
 * The temperature unit of the signed-in user, remembered in this browser's localStorage under
 * the user's id: a display choice like the colour scheme, so it needs no server round trip and
 * no schema change, and two people sharing a lab computer keep their own.
 */
@Injectable({ providedIn: 'root' })
export class TemperatureUnitSetting {
  private readonly session = inject(Session);
  private readonly key = computed(() => {
    const user = this.session.user();
    return user ? `${KEY_PREFIX}${user.id}` : null;
  });
  private readonly chosen = signal<TemperatureUnit>(readUnit(untracked(this.key)));
  /** The unit every temperature is shown and typed in. */
  readonly unit = this.chosen.asReadonly();

  constructor() {
    // Another user signing in on this browser gets their own setting back.
    effect(() => {
      const key = this.key();
      untracked(() => this.chosen.set(readUnit(key)));
    });
  }

  /** Shows every temperature in `unit` from now on, and remembers it for this user. */
  set(unit: TemperatureUnit): void {
    this.chosen.set(unit);
    const key = this.key();
    if (key) globalThis.localStorage?.setItem(key, unit);
  }
}

function readUnit(key: string | null): TemperatureUnit {
  const stored = key ? globalThis.localStorage?.getItem(key) : null;
  return stored === 'C' ? 'C' : 'K';
}
