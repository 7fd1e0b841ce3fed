import type { DopingInput } from '@rhotrace/api-types';
import { formatExponent } from '../../../shared/engineering';
import { formatValue } from '../../../shared/format';
import { type ShownFit, isSaved } from '../fit-queue';

/** The model overlay drawn from a full-model fit's values rather than from typed ones. */
export interface FittedOverlay {
  doping: DopingInput;
  mobilityScale: number;
  /** The saved fit the values come from, null for a preview. */
  fitId: number | null;
  /** The values in words, as the overlay states them. */
  words: string;
}

/** A full-model fit's values as the overlay's parameters, or null for any other fit. */
export function fittedOverlayOf(fit: ShownFit): FittedOverlay | null {
  const p = fit.parameters;
  const { donorDensity, acceptorDensity, donorLevel, acceptorLevel } = p;
  if (fit.kind !== 'model' || donorDensity === undefined || acceptorDensity === undefined)
    return null;
  const mobilityScale = p['mobilityScale'] ?? 1;
  const doping: DopingInput = {
    donorDensity,
    acceptorDensity,
    ...(donorLevel !== undefined ? { donorLevel } : {}),
    ...(acceptorLevel !== undefined ? { acceptorLevel } : {}),
  };
  const levels = [
    donorLevel !== undefined ? `donor level ${formatValue(donorLevel, 3)} eV` : null,
    acceptorLevel !== undefined ? `acceptor level ${formatValue(acceptorLevel, 3)} eV` : null,
  ].filter((x) => x !== null);
  const words = [
    `donors ${formatExponent(donorDensity)} cm⁻³`,
    `acceptors ${formatExponent(acceptorDensity)} cm⁻³`,
    ...levels,
    `mobility scale ${formatValue(mobilityScale, 3)}`,
  ].join(', ');
  return { doping, mobilityScale, fitId: isSaved(fit) ? fit.id : null, words };
}
