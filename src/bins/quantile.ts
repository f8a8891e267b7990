// Sample quantiles of the nine types of Hyndman & Fan, "Sample quantiles in statistical packages",
// The American Statistician 50(4):361–365, 1996. Type 7 is d3-array's `quantileSorted` (R's and NumPy's default).
import { quantileSorted } from 'd3-array';

export type QuantileType = 1 | 2 | 3 | 4 | 5 | 6 | 7 | 8 | 9;

/** The offset m of each type in j = floor(np + m), g = np + m − j (Hyndman & Fan 1996, section 2). */
function offset(type: QuantileType, p: number): number {
  switch (type) {
    case 1: case 2: case 4: return 0;
    case 3: return -0.5;
    case 5: return 0.5;
    case 6: return p;
    case 7: return 1 - p;
    case 8: return (p + 1) / 3;
    case 9: return p / 4 + 3 / 8;
  }
}

/** The weight γ of x[j+1]: a step for types 1–3, linear interpolation for types 4–9. */
function gamma(type: QuantileType, g: number, j: number): number {
  if (type === 1) return g > 0 ? 1 : 0;
  if (type === 2) return g > 0 ? 1 : 0.5;
  if (type === 3) return g > 0 || j % 2 === 1 ? 1 : 0;
  return g;
}

/** The p-quantile of sorted numbers under type 1–9 (Hyndman & Fan 1996); NaN for no numbers. */
export function quantileOfSorted(sorted: ArrayLike<number>, p: number, type: QuantileType = 7): number {
  const n = sorted.length;
  if (n === 0 || !(p >= 0 && p <= 1)) return NaN;
  if (type === 7) return quantileSorted(sorted as unknown as number[], p)!;
  const h = n * p + offset(type, p);
  const j = Math.floor(h);
  const gm = gamma(type, h - j, j);
  const at = (k: number) => sorted[Math.min(Math.max(k, 1), n) - 1]!; // x_0 = x_1, x_{n+1} = x_n
  const a = at(j);
  return gm === 0 ? a : gm === 1 ? at(j + 1) : a + gm * (at(j + 1) - a);
}
