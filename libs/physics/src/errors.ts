/**
 * The errors the library throws for unusable input, typed so that callers can tell which
 * function refused which argument without reading the message.
 */

/**
 * An argument of the right kind whose value the function cannot use (out of range, zero where
 * a division needs it, two arguments that disagree). The message keeps the library's form,
 * "`fourPointProbe` requires diameterCm of at least 3 probe spacings (0.3 cm), got 0.2".
 *
 * @example
 * try { vanDerPauw({ resistanceAOhm: 0, resistanceBOhm: 1 }); }
 * catch (e) { if (e instanceof PhysicsInputError) e.argument; } // 'resistanceAOhm'
 */
export class PhysicsInputError extends RangeError {
  override readonly name = 'PhysicsInputError';

  /**
   * @param functionName the public function that refused its input, e.g. `fourPointProbe`
   * @param argument the argument refused, e.g. `diameterCm`; two arguments refused together
   *   are joined by " and " (`voltageV and currentA`)
   * @param requirement the rest of the message after the function name, e.g.
   *   "requires diameterCm above 0, got -1"
   */
  constructor(
    readonly functionName: string,
    readonly argument: string,
    readonly requirement: string,
  ) {
    super(`\`${functionName}\` ${requirement}`);
  }
}

/**
 * An argument of the wrong kind (a string where a number belongs, null where an object
 * belongs): a programming error in the caller rather than a bad reading.
 */
export class PhysicsTypeError extends TypeError {
  override readonly name = 'PhysicsTypeError';

  /** Same fields as `PhysicsInputError`. */
  constructor(
    readonly functionName: string,
    readonly argument: string,
    readonly requirement: string,
  ) {
    super(`\`${functionName}\` ${requirement}`);
  }
}
