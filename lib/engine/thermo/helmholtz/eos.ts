/**
 * General multiparameter Helmholtz-energy equation of state for a pure fluid:
 *
 *   a(ρ,T) / (R·T) = α°(δ,τ) + αʳ(δ,τ),   δ = ρ/ρ_r,  τ = T_r/T
 *
 * with the term families used by the reference equations in this module (Span & Wagner 1996,
 * Tillner-Roth & Baehr 1994, Tillner-Roth et al. 1993, Lemmon et al. 2009, Thol & Lemmon 2016):
 * polynomial/exponential terms n·δ^d·τ^t·exp(−δ^l), Gaussian bell-shaped terms
 * n·δ^d·τ^t·exp(−η(δ−ε)² − β(τ−γ)²) and the IAPWS-95 style non-analytic critical terms
 * n·Δ^b·δ·ψ. Property relations follow Span (2000), "Multiparameter Equations of State", Table 3.3.
 */

/**
 * n·δ^d·τ^t·exp(−δ^l)·exp(−τ^m); l = 0 means no δ exponential; `m` (optional, 0 = none) is the
 * τ exponential of the Lemmon & Jacobsen (2005) form used by R125.
 */
export interface PowerTerms {
  n: readonly number[];
  d: readonly number[];
  t: readonly number[];
  l: readonly number[];
  m?: readonly number[];
}

/** n·δ^d·τ^t·exp(−η(δ−ε)² − β(τ−γ)²). */
export interface GaussianTerms {
  n: readonly number[];
  d: readonly number[];
  t: readonly number[];
  eta: readonly number[];
  epsilon: readonly number[];
  beta: readonly number[];
  gamma: readonly number[];
}

/**
 * Non-analytic terms n·Δ^b·δ·ψ (Span & Wagner 1996 eq. 6.1, same form as IAPWS-95):
 * θ = (1−τ) + A·((δ−1)²)^(1/(2β)), Δ = θ² + B·((δ−1)²)^a, ψ = exp(−C(δ−1)² − D(τ−1)²).
 */
export interface NonAnalyticTerms {
  n: readonly number[];
  a: readonly number[];
  b: readonly number[];
  beta: readonly number[];
  A: readonly number[];
  B: readonly number[];
  C: readonly number[];
  D: readonly number[];
}

/**
 * Ideal-gas part: α° = ln δ + a1 + a2·τ + c·ln τ + Σ nᵢ·τ^tᵢ + Σ mⱼ·ln(1 − exp(−θⱼ·τ)).
 * (A cp0 polynomial/Planck–Einstein form integrates to exactly this shape.)
 */
export interface IdealGasPart {
  a1: number;
  a2: number;
  logTau: number;
  power?: { n: readonly number[]; t: readonly number[] };
  planckEinstein?: { n: readonly number[]; theta: readonly number[] };
}

export interface HelmholtzEosData {
  /** Reducing temperature T_r, K. */
  tReducingK: number;
  /** Reducing density ρ_r, kg/m³. */
  rhoReducingKgM3: number;
  /** Molar gas constant used by the equation, J/(mol·K). */
  gasConstantJmolK: number;
  molarMassKgMol: number;
  ideal: IdealGasPart;
  power?: PowerTerms;
  gaussian?: GaussianTerms;
  nonAnalytic?: NonAnalyticTerms;
}

/** Reduced Helmholtz energy and the derivatives the properties need (all multiplied out). */
export interface AlphaDerivs {
  /** αʳ */
  ar: number;
  /** δ·∂αʳ/∂δ */
  dAr: number;
  /** δ²·∂²αʳ/∂δ² */
  ddAr: number;
  /** τ·∂αʳ/∂τ */
  tAr: number;
  /** τ²·∂²αʳ/∂τ² */
  ttAr: number;
  /** δ·τ·∂²αʳ/∂δ∂τ */
  dtAr: number;
  /** α° without ln δ */
  a0: number;
  /** τ·∂α°/∂τ */
  tA0: number;
  /** τ²·∂²α°/∂τ² */
  ttA0: number;
}

interface CompiledPower {
  n: Float64Array;
  d: Float64Array;
  t: Float64Array;
  l: Int32Array;
  m: Float64Array;
  hasM: boolean;
  intD: boolean;
}

/** A compiled equation: flat typed arrays and precomputed constants for speed. */
export class HelmholtzEos {
  readonly tr: number;
  readonly rhor: number;
  /** Specific gas constant, J/(kg·K). */
  readonly r: number;
  private readonly ideal: IdealGasPart;
  private readonly pw: CompiledPower;
  private readonly gs: GaussianTerms | undefined;
  private readonly na: NonAnalyticTerms | undefined;
  private readonly maxL: number;

  constructor(readonly data: HelmholtzEosData) {
    this.tr = data.tReducingK;
    this.rhor = data.rhoReducingKgM3;
    this.r = data.gasConstantJmolK / data.molarMassKgMol;
    this.ideal = data.ideal;
    const p = data.power ?? { n: [], d: [], t: [], l: [] };
    this.pw = {
      n: Float64Array.from(p.n),
      d: Float64Array.from(p.d),
      t: Float64Array.from(p.t),
      l: Int32Array.from(p.l),
      m: Float64Array.from(p.m ?? p.n.map(() => 0)),
      hasM: (p.m ?? []).some((x) => x !== 0),
      intD: p.d.every((x) => Number.isInteger(x)),
    };
    this.maxL = p.l.reduce((m, x) => Math.max(m, x), 0);
    this.gs = data.gaussian;
    this.na = data.nonAnalytic;
  }

  /**
   * Fills `out` with αʳ, α° and their reduced derivatives at (δ, τ). With `residualOnly` the
   * ideal-gas part (a function of τ alone) is left untouched, for density iterations.
   */
  evaluate(delta: number, tau: number, out: AlphaDerivs, residualOnly = false): AlphaDerivs {
    let ar = 0,
      dAr = 0,
      ddAr = 0,
      tAr = 0,
      ttAr = 0,
      dtAr = 0;
    const lnD = Math.log(delta);
    const lnT = Math.log(tau);
    // δ^l and exp(−δ^l) for the few integer l values in use
    const dl = powL;
    const el = expL;
    let x = 1;
    for (let l = 1; l <= this.maxL; l++) {
      x *= delta;
      dl[l] = x;
      el[l] = Math.exp(-x);
    }
    const { n, d, t, l, m, hasM } = this.pw;
    for (let i = 0; i < n.length; i++) {
      const li = l[i];
      const di = d[i];
      const ti = t[i];
      let f = n[i] * Math.exp(di * lnD + ti * lnT);
      let a: number, b: number;
      if (li === 0) {
        a = di;
        b = -di;
      } else {
        const dL = li * dl[li];
        f *= el[li];
        a = di - dL;
        b = -di - (li - 1) * dL;
      }
      const mi = hasM ? m[i] : 0;
      if (mi === 0) {
        ar += f;
        dAr += f * a;
        ddAr += f * (a * a + b);
        tAr += f * ti;
        ttAr += f * ti * (ti - 1);
        dtAr += f * ti * a;
      } else {
        // exp(−τ^m): τ∂/∂τ gives c = t − m·τ^m, τ²∂²/∂τ² gives c² − c − m²·τ^m
        const tm = Math.exp(mi * lnT);
        f *= Math.exp(-tm);
        const c = ti - mi * tm;
        ar += f;
        dAr += f * a;
        ddAr += f * (a * a + b);
        tAr += f * c;
        ttAr += f * (c * c - c - mi * mi * tm);
        dtAr += f * c * a;
      }
    }
    const g = this.gs;
    if (g) {
      for (let i = 0; i < g.n.length; i++) {
        const dd = delta - g.epsilon[i];
        const tt = tau - g.gamma[i];
        const f = g.n[i] * Math.exp(g.d[i] * lnD + g.t[i] * lnT - g.eta[i] * dd * dd - g.beta[i] * tt * tt);
        const a = g.d[i] - 2 * g.eta[i] * delta * dd;
        const c = g.t[i] - 2 * g.beta[i] * tau * tt;
        ar += f;
        dAr += f * a;
        ddAr += f * (a * a - g.d[i] - 2 * g.eta[i] * delta * delta);
        tAr += f * c;
        ttAr += f * (c * c - g.t[i] - 2 * g.beta[i] * tau * tau);
        dtAr += f * a * c;
      }
    }
    const na = this.na;
    if (na) {
      // Exactly at δ = 1 the terms are finite but their derivative formulas divide by (δ−1).
      const dlt = delta === 1 ? 1 + 1e-12 : delta;
      for (let i = 0; i < na.n.length; i++) {
        const r = nonAnalytic(na, i, dlt, tau);
        ar += r[0];
        dAr += dlt * r[1];
        ddAr += dlt * dlt * r[2];
        tAr += tau * r[3];
        ttAr += tau * tau * r[4];
        dtAr += dlt * tau * r[5];
      }
    }
    out.ar = ar;
    out.dAr = dAr;
    out.ddAr = ddAr;
    out.tAr = tAr;
    out.ttAr = ttAr;
    out.dtAr = dtAr;
    if (residualOnly) return out;
    return this.evaluateIdeal(tau, out);
  }

  /** Fills the ideal-gas part of `out` (α° without ln δ and its τ-derivatives) at τ. */
  evaluateIdeal(tau: number, out: AlphaDerivs): AlphaDerivs {
    const lnT = Math.log(tau);
    const id = this.ideal;
    let a0 = id.a1 + id.a2 * tau + id.logTau * lnT;
    let tA0 = id.a2 * tau + id.logTau;
    let ttA0 = -id.logTau;
    if (id.power) {
      const { n: pn, t: pt } = id.power;
      for (let i = 0; i < pn.length; i++) {
        const v = pn[i] * Math.exp(pt[i] * lnT);
        a0 += v;
        tA0 += pt[i] * v;
        ttA0 += pt[i] * (pt[i] - 1) * v;
      }
    }
    if (id.planckEinstein) {
      const { n: en, theta } = id.planckEinstein;
      for (let i = 0; i < en.length; i++) {
        const th = theta[i] * tau;
        const e = Math.exp(-th);
        const om = 1 - e;
        a0 += en[i] * Math.log(om);
        tA0 += (en[i] * th * e) / om;
        ttA0 -= (en[i] * th * th * e) / (om * om);
      }
    }
    out.a0 = a0;
    out.tA0 = tA0;
    out.ttA0 = ttA0;
    return out;
  }
}

const powL = new Float64Array(16);
const expL = new Float64Array(16);
const naOut = new Float64Array(6);

/**
 * One non-analytic term and its plain partial derivatives
 * [α, ∂α/∂δ, ∂²α/∂δ², ∂α/∂τ, ∂²α/∂τ², ∂²α/∂δ∂τ]; formulas of IAPWS-95 (Wagner & Pruß 2002,
 * Table 5) which Span & Wagner (1996, Table 32) share.
 */
function nonAnalytic(na: NonAnalyticTerms, i: number, delta: number, tau: number): Float64Array {
  const n = na.n[i],
    a = na.a[i],
    b = na.b[i],
    beta = na.beta[i],
    A = na.A[i],
    B = na.B[i],
    C = na.C[i],
    D = na.D[i];
  const dm1 = delta - 1;
  const dm1sq = dm1 * dm1;
  const tm1 = tau - 1;
  const psi = Math.exp(-C * dm1sq - D * tm1 * tm1);
  // powers of (δ−1)² derived from two pow() calls (this is the costly part of the evaluator)
  const q = Math.pow(dm1sq, 1 / (2 * beta));
  const qa = Math.pow(dm1sq, a);
  const theta = 1 - tau + A * q;
  const Delta = theta * theta + B * qa;
  const psiD = -2 * C * dm1 * psi;
  const psiDD = (2 * C * dm1sq - 1) * 2 * C * psi;
  const psiT = -2 * D * tm1 * psi;
  const psiTT = (2 * D * tm1 * tm1 - 1) * 2 * D * psi;
  const psiDT = 4 * C * D * dm1 * tm1 * psi;
  const p1 = q / dm1sq;
  const qa1 = qa / dm1sq;
  const dDelta = dm1 * ((A * theta * 2) / beta * p1 + 2 * B * a * qa1);
  const ddDelta =
    dDelta / dm1 +
    dm1sq *
      (4 * B * a * (a - 1) * (qa1 / dm1sq) +
        2 * A * A * (1 / beta) * (1 / beta) * p1 * p1 +
        ((A * theta * 4) / beta) * (1 / (2 * beta) - 1) * (p1 / dm1sq));
  const Db = Math.pow(Delta, b);
  const Db1 = Db / Delta;
  const Db2 = Db1 / Delta;
  const DbD = b * Db1 * dDelta;
  const DbDD = b * (Db1 * ddDelta + (b - 1) * Db2 * dDelta * dDelta);
  const DbT = -2 * theta * b * Db1;
  const DbTT = 2 * b * Db1 + 4 * theta * theta * b * (b - 1) * Db2;
  const DbDT = ((-A * b * 2) / beta) * Db1 * dm1 * p1 - 2 * theta * b * (b - 1) * Db2 * dDelta;
  naOut[0] = n * Db * delta * psi;
  naOut[1] = n * (Db * (psi + delta * psiD) + DbD * delta * psi);
  naOut[2] = n * (Db * (2 * psiD + delta * psiDD) + 2 * DbD * (psi + delta * psiD) + DbDD * delta * psi);
  naOut[3] = n * delta * (DbT * psi + Db * psiT);
  naOut[4] = n * delta * (DbTT * psi + 2 * DbT * psiT + Db * psiTT);
  naOut[5] = n * (Db * (psiT + delta * psiDT) + delta * DbD * psiT + DbT * (psi + delta * psiD) + DbDT * delta * psi);
  return naOut;
}

export function newAlpha(): AlphaDerivs {
  return { ar: 0, dAr: 0, ddAr: 0, tAr: 0, ttAr: 0, dtAr: 0, a0: 0, tA0: 0, ttA0: 0 };
}
