/**
 * Natural cubic splines on one uniform grid, many series at once (the series share the grid,
 * so the cell index and the four weights are computed once per query). Formula: the standard
 * cubic spline with second-derivative coefficients M_i (e.g. Press et al., "Numerical
 * Recipes", 3rd ed., §3.3).
 */
export class UniformSplines {
  readonly n: number;
  readonly x0: number;
  readonly dx: number;
  private readonly y: Float64Array[];
  private readonly m: Float64Array[];
  // Weights of the last `locate`.
  private i = 0;
  private wa = 0;
  private wb = 0;
  private wc = 0;
  private wd = 0;

  constructor(x0: number, dx: number, series: Float64Array[]) {
    this.n = series[0].length;
    this.x0 = x0;
    this.dx = dx;
    this.y = series;
    this.m = series.map((s) => naturalSecondDerivatives(s, dx));
  }

  get xMax(): number {
    return this.x0 + (this.n - 1) * this.dx;
  }

  /** Sets the cell and weights for abscissa x (clamped to the grid). */
  locate(x: number): void {
    let f = (x - this.x0) / this.dx;
    let i = Math.floor(f);
    if (i < 0) i = 0;
    else if (i > this.n - 2) i = this.n - 2;
    f -= i;
    const a = 1 - f;
    const h2 = (this.dx * this.dx) / 6;
    this.i = i;
    this.wa = a;
    this.wb = f;
    this.wc = (a * a * a - a) * h2;
    this.wd = (f * f * f - f) * h2;
  }

  /** Value of series k at the located abscissa. */
  value(k: number): number {
    const y = this.y[k];
    const m = this.m[k];
    const i = this.i;
    return this.wa * y[i] + this.wb * y[i + 1] + this.wc * m[i] + this.wd * m[i + 1];
  }

  /** d(series k)/dx at the located abscissa. */
  slope(k: number): number {
    const y = this.y[k];
    const m = this.m[k];
    const i = this.i;
    const h = this.dx;
    return (y[i + 1] - y[i]) / h - ((3 * this.wa * this.wa - 1) * h * m[i]) / 6 + ((3 * this.wb * this.wb - 1) * h * m[i + 1]) / 6;
  }

  /** Raw node values of series k. */
  nodes(k: number): Float64Array {
    return this.y[k];
  }
}

function naturalSecondDerivatives(y: Float64Array, h: number): Float64Array {
  const n = y.length;
  const m = new Float64Array(n);
  const c = new Float64Array(n);
  // Thomas algorithm for the tridiagonal system (h, 4h, h)·M = 6Δ²y/h with M_0 = M_{n−1} = 0.
  const d = new Float64Array(n);
  for (let i = 1; i < n - 1; i++) d[i] = (6 * (y[i + 1] - 2 * y[i] + y[i - 1])) / (h * h);
  c[1] = 0.25;
  d[1] /= 4;
  for (let i = 2; i < n - 1; i++) {
    const den = 4 - c[i - 1];
    c[i] = 1 / den;
    d[i] = (d[i] - d[i - 1]) / den;
  }
  m[n - 2] = d[n - 2];
  for (let i = n - 3; i >= 1; i--) m[i] = d[i] - c[i] * m[i + 1];
  return m;
}
