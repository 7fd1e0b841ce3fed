/**
 * Cautions and warnings that come from a plan itself: its temperatures (cryogens below 200 K,
 * a hot chuck above 400 K), the material, and its currents (a voltage the meter cannot read
 * well, power over the limit, power per contact that heats thin films).
 */
import type { PlanStepDto } from '@rhotrace/api-types';
import {
  CRYOGEN,
  DEFER_TO_LAB_RULES,
  HOT_CHUCK,
  PROBE_HEATING,
  TOXIC_COMPOUND,
} from '../assignments/assignment-safety';

/** Steps below this temperature need a cryogen (liquid nitrogen boils at 77 K), K. */
export const CRYOGEN_BELOW_K = 200;
/** Steps above this temperature make the chuck a burn hazard, K. */
export const HOT_CHUCK_ABOVE_K = 400;
/**
 * Power per current contact above which thin films risk local heating, W: half the power the
 * sample dissipates, since the two current contacts carry it and the spreading resistance
 * concentrates it under them. 1 mW (common practice, no source): well below what burns through
 * a film, high enough that a bulk wafer is unaffected.
 */
export const HEATING_POWER_PER_CONTACT_W = 1e-3;

/** The safety cautions for a plan over `stepsK` on `material`; always ends deferring to the lab. */
export function planCautions(material: string, stepsK: readonly number[]): string[] {
  const cautions: string[] = [];
  if (Math.min(...stepsK) < CRYOGEN_BELOW_K) cautions.push(CRYOGEN);
  if (Math.max(...stepsK) > HOT_CHUCK_ABOVE_K) cautions.push(HOT_CHUCK);
  if (/gaas|arsenic|inas|algaas/i.test(material)) cautions.push(TOXIC_COMPOUND(material));
  cautions.push(DEFER_TO_LAB_RULES);
  return cautions;
}

const list = (steps: PlanStepDto[]) => {
  const shown = steps.slice(0, 6).map((s) => `${s.temperatureK.toFixed(1)} K`);
  return steps.length > 6 ? `${shown.join(', ')} and ${steps.length - 6} more` : shown.join(', ');
};

/**
 * Warnings where the plan falls short: voltages outside the meter's readable window, power over
 * the limit (only when a minimum current forces it), power per contact over
 * `HEATING_POWER_PER_CONTACT_W`.
 */
export function planWarnings(
  steps: PlanStepDto[],
  limits: { readableVoltageV: [number, number]; maxPowerW: number },
): string[] {
  const [lowV, highV] = limits.readableVoltageV;
  const warnings: string[] = [];
  const low = steps.filter((s) => s.voltageV < lowV);
  const high = steps.filter((s) => s.voltageV > highV);
  const hot = steps.filter((s) => s.powerW > limits.maxPowerW);
  const heating = steps.filter((s) => s.powerW / 2 > HEATING_POWER_PER_CONTACT_W);
  if (low.length) {
    warnings.push(
      `The voltage falls below the meter's readable window (${lowV.toExponential(2)} V, a ` +
        `thousandth of the maximum) at ${list(low)}: the reading there will be noisy.`,
    );
  }
  if (high.length) {
    warnings.push(
      `The voltage exceeds the meter's maximum (${highV} V) at ${list(high)}: the minimum ` +
        'current of the source is too large there.',
    );
  }
  if (hot.length) {
    warnings.push(
      `The power in the sample exceeds ${limits.maxPowerW} W at ${list(hot)}: the minimum ` +
        'current of the source is too large there.',
    );
  }
  if (heating.length) {
    warnings.push(
      `More than ${HEATING_POWER_PER_CONTACT_W * 1e3} mW per current contact at ` +
        `${list(heating)}. ${PROBE_HEATING}`,
    );
  }
  return warnings;
}
