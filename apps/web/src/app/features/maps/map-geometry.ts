/**
 * Drawing geometry of a wafer: its outline with the flat or notch at -y, in screen
 * coordinates (mm, y downward), drawn schematically: the flat spans 30 % of the diameter and
 * the notch is enlarged to be seen (product choice, not to a wafer specification).
 */

/** The SVG path of a wafer's outline, centred on the origin, flat or notch toward the bottom. */
export function outlinePath(diameterMm: number, outline: 'flat' | 'notch'): string {
  const r = diameterMm / 2;
  const f = (v: number) => v.toFixed(3);
  if (outline === 'flat') {
    const half = 0.15 * diameterMm;
    const h = Math.sqrt(r * r - half * half);
    return `M ${f(half)} ${f(h)} A ${f(r)} ${f(r)} 0 1 0 ${f(-half)} ${f(h)} Z`;
  }
  const half = 0.03 * r;
  const depth = 0.05 * r;
  const h = Math.sqrt(r * r - half * half);
  return (
    `M ${f(half)} ${f(h)} A ${f(r)} ${f(r)} 0 1 0 ${f(-half)} ${f(h)} ` + `L 0 ${f(r - depth)} Z`
  );
}
