/** A row's polarity cell and the sign it gives the current (forward +, reverse -). */

const FORWARD = /^(\+|\+1|1|f|fwd|forward|pos|positive|p|normal|\+i)$/i;
const REVERSE = /^(-|-1|r|rev|reverse|neg|negative|n|reversed|-i)$/i;

/** 1 for a forward cell, -1 for a reverse one, null when the text is neither. */
export function polarityOf(text: string): 1 | -1 | null {
  if (FORWARD.test(text)) return 1;
  if (REVERSE.test(text)) return -1;
  return null;
}

/**
 * The current with the sign its polarity gives it, or the problem with it. A reverse reading may
 * give the current as a magnitude: it flows the other way.
 */
export function signCurrent(currentA: number, polarity: 1 | -1 | 0): number | { problem: string } {
  const signed = polarity === -1 && currentA > 0 ? -currentA : currentA;
  const wrong = polarity === -1 ? signed >= 0 : signed <= 0;
  if (!wrong) return signed;
  return {
    problem:
      polarity === 0 && signed < 0
        ? `the current is negative (${signed} A); mark reverse-polarity readings in a polarity column`
        : `the current must not be zero or point the wrong way (${signed} A)`,
  };
}
