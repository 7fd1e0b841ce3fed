import type { Order } from 'sequelize';

/**
 * Helpers that turn validated request values into query parts: services use them, so the SQL
 * side of a list (sorting, searching, dates) is written once.
 */

/** A `sort` value (`field` or `-field`) as a Sequelize order, with `id` as tie-breaker. */
export function orderFrom(sort: string | undefined, fallback: string): Order {
  const value = sort ?? fallback;
  const direction = value.startsWith('-') ? 'DESC' : 'ASC';
  const field = direction === 'DESC' ? value.slice(1) : value;
  return [
    [field, direction],
    ['id', direction],
  ];
}

/** `%…%` pattern for LIKE with `%`, `_` and `\` in the user's text taken literally. */
export function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/** Today's date in UTC as `YYYY-MM-DD`. */
export const todayIso = (): string => new Date().toISOString().slice(0, 10);
