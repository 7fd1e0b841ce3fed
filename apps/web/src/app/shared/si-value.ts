const PREFIXES: ReadonlyArray<[number, string]> = [
  [1e-12, 'p'],
  [1e-9, 'n'],
  [1e-6, 'µ'],
  [1e-3, 'm'],
  [1, ''],
  [1e3, 'k'],
  [1e6, 'M'],
];

/** A value with an SI prefix and three significant figures, as a source is set: 453 µA. */
export function siValue(value: number, unit: string): string {
  if (value === 0 || !Number.isFinite(value)) return `${value} ${unit}`;
  let [scale, prefix] = PREFIXES[0]!;
  for (const [s, p] of PREFIXES) if (Math.abs(value) >= s * (1 - 5e-4)) [scale, prefix] = [s, p];
  return `${Number((value / scale).toPrecision(3))} ${prefix}${unit}`;
}
