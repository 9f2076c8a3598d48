/**
 * Least-squares polynomial fit, as a spectrograph's wavelength calibration uses one (λ as a
 * polynomial in pixel). Solved by Householder QR on the Vandermonde matrix in a coordinate scaled
 * to [−1, 1], which keeps a cubic over thousands of pixels well conditioned; the normal equations
 * would square the condition number (Golub & Van Loan, Matrix Computations, ch. 5).
 *
 * Written here rather than taken from mathjs: the web app loads mathjs as a separate chunk after
 * the first paint (mathjs-units.ts), and a solver import of `lusolve` would pull it into every
 * screen for a 4 × 4 solve. No installed package offers a polynomial least-squares fit.
 */

export interface PolynomialFit {
  degree: number;
  /** Coefficients of `t⁰ … t^degree` in the scaled coordinate `t = (x − centre) / halfWidth`. */
  coefficients: number[];
  centre: number;
  halfWidth: number;
}

/**
 * The polynomial of `degree` that minimises `Σ (y − p(x))²`, or null when it is not determined
 * (fewer distinct points than coefficients, lengths that differ, a value that is not finite).
 */
export function fitPolynomial(xs: readonly number[], ys: readonly number[], degree: number): PolynomialFit | null {
  const n = xs.length;
  const k = degree + 1;
  if (!Number.isInteger(degree) || degree < 0 || ys.length !== n || n < k) return null;
  let lo = Number.POSITIVE_INFINITY;
  let hi = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < n; i++) {
    const x = xs[i] as number;
    if (!Number.isFinite(x) || !Number.isFinite(ys[i] as number)) return null;
    lo = Math.min(lo, x);
    hi = Math.max(hi, x);
  }
  const centre = (lo + hi) / 2;
  const halfWidth = hi > lo ? (hi - lo) / 2 : 1;

  // Column-major Vandermonde matrix in t, reduced to R in place; b becomes Qᵀy.
  const columns: Float64Array[] = [];
  for (let j = 0; j < k; j++) columns.push(new Float64Array(n));
  for (let i = 0; i < n; i++) {
    const t = ((xs[i] as number) - centre) / halfWidth;
    let power = 1;
    for (let j = 0; j < k; j++) {
      (columns[j] as Float64Array)[i] = power;
      power *= t;
    }
  }
  const b = Float64Array.from(ys);
  const v = new Float64Array(n);
  let largestDiagonal = 0;
  for (let j = 0; j < k; j++) {
    const col = columns[j] as Float64Array;
    let norm = 0;
    for (let i = j; i < n; i++) norm += (col[i] as number) ** 2;
    norm = Math.sqrt(norm);
    if (norm === 0) return null;
    // Reflect onto −sign(a_jj)·‖a‖ e_j so v_j never cancels.
    const alpha = (col[j] as number) > 0 ? -norm : norm;
    v[j] = (col[j] as number) - alpha;
    for (let i = j + 1; i < n; i++) v[i] = col[i] as number;
    let vv = 0;
    for (let i = j; i < n; i++) vv += (v[i] as number) ** 2;
    const reflect = (target: Float64Array) => {
      let dot = 0;
      for (let i = j; i < n; i++) dot += (v[i] as number) * (target[i] as number);
      const scale = (2 * dot) / vv;
      for (let i = j; i < n; i++) target[i] = (target[i] as number) - scale * (v[i] as number);
    };
    for (let c = j; c < k; c++) reflect(columns[c] as Float64Array);
    reflect(b);
    largestDiagonal = Math.max(largestDiagonal, Math.abs(col[j] as number));
  }

  // Back substitution on R; a diagonal lost in rounding means too few distinct x.
  const coefficients = new Array<number>(k).fill(0);
  for (let j = k - 1; j >= 0; j--) {
    const diagonal = (columns[j] as Float64Array)[j] as number;
    if (!(Math.abs(diagonal) > 1e-12 * largestDiagonal)) return null;
    let sum = b[j] as number;
    for (let c = j + 1; c < k; c++) sum -= ((columns[c] as Float64Array)[j] as number) * (coefficients[c] as number);
    coefficients[j] = sum / diagonal;
  }
  return { degree, coefficients, centre, halfWidth };
}

/** The fitted polynomial at `x` (Horner's rule in the scaled coordinate). */
export function evaluatePolynomialFit(fit: PolynomialFit, x: number): number {
  const t = (x - fit.centre) / fit.halfWidth;
  let value = 0;
  for (let j = fit.coefficients.length - 1; j >= 0; j--) value = value * t + (fit.coefficients[j] as number);
  return value;
}
