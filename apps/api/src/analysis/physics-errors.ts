import { badRequest, unprocessable } from '../errors';

/**
 * Runs a physics library call and turns its RangeError/TypeError (which names the function and
 * argument) into a 400 naming the request field, so bad input never becomes a 500.
 */
export function withPhysics<T>(field: string, call: () => T): T {
  try {
    return call();
  } catch (error) {
    if (error instanceof RangeError || error instanceof TypeError) {
      throw badRequest(`${field}: ${error.message}`, [{ field, problem: error.message }]);
    }
    throw error;
  }
}

/** As `withPhysics`, for data the server holds (a stored sweep): a 422, not a 400. */
export function withPhysicsOnData<T>(what: string, call: () => T): T {
  try {
    return call();
  } catch (error) {
    if (error instanceof RangeError || error instanceof TypeError) {
      throw unprocessable(`${what}: ${error.message}`);
    }
    throw error;
  }
}
