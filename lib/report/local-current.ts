/**
 * The hot spot of a uniform-voltage cell: the point of the fuel path with the highest local
 * current density (results.fuelPath.points, the largest currentDensity_A_per_m2; the first on a
 * tie), which the method names, a worked line evaluates and the current-density figure marks.
 */
import type { Results } from '../plant/results-schema.ts';

export function hotSpot(r: Results): { index: number; point: Results['fuelPath']['points'][number] } {
  const points = r.fuelPath.points;
  let index = 0;
  points.forEach((p, k) => {
    if (p.currentDensity_A_per_m2 > points[index]!.currentDensity_A_per_m2) index = k;
  });
  return { index, point: points[index]! };
}
