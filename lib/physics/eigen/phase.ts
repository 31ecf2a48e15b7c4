// Deterministic phase (or sign) convention for eigenvectors, and grouping of degenerate levels.
// Makes results comparable run to run and between solvers: the largest-modulus component is real and positive.

/** Components within this relative distance of the largest modulus count as tied (the lowest index wins). */
const TIE_RTOL = 1e-8;

/**
 * Multiplies each column by a unit phase so that its largest-modulus component is real and positive; among
 * components tied within 1e-8 relative, the one with the lowest index is used. Works in place.
 *
 * @param n - vector length
 * @param k - number of columns (column j at [j * n, (j + 1) * n))
 * @param re - real parts
 * @param im - imaginary parts, or null (then only the sign is fixed)
 * @example
 * fixPhases(2, 1, new Float64Array([0, -1]), null); // re becomes [0, 1]
 */
export function fixPhases(n: number, k: number, re: Float64Array, im: Float64Array | null): void {
  for (let j = 0; j < k; j++) {
    const o = j * n;
    let max = 0;
    for (let r = 0; r < n; r++) {
      const m2 = re[o + r] ** 2 + (im ? im[o + r] ** 2 : 0);
      if (m2 > max) max = m2;
    }
    if (max === 0) continue;
    let pick = 0;
    for (let r = 0; r < n; r++) {
      const m2 = re[o + r] ** 2 + (im ? im[o + r] ** 2 : 0);
      if (m2 >= max * (1 - TIE_RTOL) ** 2) {
        pick = r;
        break;
      }
    }
    const a = re[o + pick];
    const b = im ? im[o + pick] : 0;
    const mod = Math.hypot(a, b);
    // Multiply by conj(z)/|z|.
    const cr = a / mod;
    const ci = -b / mod;
    if (!im) {
      if (cr < 0) for (let r = o; r < o + n; r++) re[r] = -re[r];
      continue;
    }
    for (let r = o; r < o + n; r++) {
      const x = re[r];
      const y = im[r];
      re[r] = x * cr - y * ci;
      im[r] = x * ci + y * cr;
    }
    im[o + pick] = 0;
  }
}

/**
 * Groups of indices of ascending levels that are equal within tolerance: consecutive levels i, i+1 belong together
 * when |E[i+1] - E[i]| <= tol * max(1, |E[i]|). Only groups of two or more levels are returned.
 *
 * @param values - ascending levels
 * @param tol - relative tolerance, e.g. 1e-6
 * @example
 * degenerateGroups([5.78, 14.68, 14.68, 26.37], 1e-6); // [[1, 2]]
 */
export function degenerateGroups(values: ArrayLike<number>, tol: number): number[][] {
  const groups: number[][] = [];
  let current = [0];
  for (let i = 1; i < values.length; i++) {
    if (Math.abs(values[i] - values[i - 1]) <= tol * Math.max(1, Math.abs(values[i - 1]))) current.push(i);
    else {
      if (current.length > 1) groups.push(current);
      current = [i];
    }
  }
  if (values.length > 0 && current.length > 1) groups.push(current);
  return groups;
}
