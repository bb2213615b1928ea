import type { CubicComponent } from "./components";

/** Molar gas constant, J/(mol·K) (CODATA 2018, exact by the SI definition). */
export const R_GAS = 8.314462618;
const SQRT2 = Math.SQRT2;
/** Temperature of the ideal-gas enthalpy/entropy origin; any value works, the IIR offset absorbs it. */
const T0_K = 273.15;
/** Pressure of the ideal-gas entropy origin. */
const P0_PA = 1e5;

/** Which root of the cubic a phase takes: the smallest (liquid) or the largest (vapour). */
export type RootKind = 0 | 1;
export const LIQUID_ROOT: RootKind = 0;
export const VAPOUR_ROOT: RootKind = 1;

/** Result of one phase evaluation, molar and per mole of mixture. Reused between calls. */
export interface PhaseEval {
  /** Compressibility factor of the untranslated PR volume. */
  z: number;
  /** Molar volume after the Péneloux shift, m³/mol. */
  vM3Mol: number;
  /** Molar enthalpy, J/mol (ideal-gas part from T0 plus departure). */
  hJmol: number;
  /** Molar entropy, J/(mol·K). */
  sJmolK: number;
  cpJmolK: number;
  cvJmolK: number;
  /** (∂P/∂v)_T in Pa·mol/m³. */
  dPdvT: number;
  molarMassKgMol: number;
}

/**
 * Peng–Robinson equation of state (Peng & Robinson, Ind. Eng. Chem. Fundam. 15, 1976) for a
 * mixture, with the Mathias–Copeman alpha function, van der Waals one-fluid mixing rules
 * (a = ΣΣ x_i x_j √(a_i a_j)(1 − k_ij), b = Σ x_i b_i) and a Péneloux volume shift
 * (c = Σ x_i c_i), which changes volumes and enthalpies (h − P·c) but no phase equilibrium.
 * Fugacity coefficients and departure functions are the textbook PR forms (e.g. Michelsen &
 * Mollerup, "Thermodynamic Models: Fundamentals & Computational Aspects", 2007).
 *
 * The object keeps scratch arrays so that the hot loops allocate nothing.
 */
export class PengRobinsonMixture {
  readonly n: number;
  readonly components: readonly CubicComponent[];
  private readonly sqrtAc: Float64Array;
  private readonly bi: Float64Array;
  private readonly ci: Float64Array;
  private readonly mi: Float64Array;
  private readonly k0: Float64Array;
  private readonly k1: Float64Array;
  /** 1 − k_ij(T) and its T-derivative at the cached temperature. */
  private readonly oneMinusK: Float64Array;
  private readonly dOneMinusK: Float64Array;
  // Temperature-dependent √a_i and its first two T-derivatives, cached per temperature.
  private cachedT = NaN;
  private readonly s: Float64Array;
  private readonly ds: Float64Array;
  private readonly d2s: Float64Array;
  /** Σ_j x_j (1−k_ij) √(a_i a_j) of the last `evaluate`, for fugacities. */
  private readonly sumA: Float64Array;
  readonly lnPhi: Float64Array;
  /** The ideal-gas integrals at T0 (per component, dimensionless ×R), subtracted in `evaluate`. */
  private readonly h0Ref: Float64Array;
  private readonly s0Ref: Float64Array;

  /**
   * @param kij k_ij at 280 K per pair (symmetric matrix, zero diagonal)
   * @param kijSlope dk_ij/dT per 100 K; k_ij(T) = k_ij + slope·(T − 280 K)/100 K
   */
  constructor(components: readonly CubicComponent[], kij: readonly (readonly number[])[], kijSlope?: readonly (readonly number[])[]) {
    const n = components.length;
    this.n = n;
    this.components = components;
    this.sqrtAc = new Float64Array(n);
    this.bi = new Float64Array(n);
    this.ci = new Float64Array(n);
    this.mi = new Float64Array(n);
    this.k0 = new Float64Array(n * n);
    this.k1 = new Float64Array(n * n);
    this.oneMinusK = new Float64Array(n * n);
    this.dOneMinusK = new Float64Array(n * n);
    this.s = new Float64Array(n);
    this.ds = new Float64Array(n);
    this.d2s = new Float64Array(n);
    this.sumA = new Float64Array(n);
    this.lnPhi = new Float64Array(n);
    this.h0Ref = new Float64Array(n);
    this.s0Ref = new Float64Array(n);
    const t0 = T0_K / 100;
    for (let i = 0; i < n; i++) {
      const c = components[i];
      // Ω_a = 0.45723553, Ω_b = 0.07779607: the PR constants from the critical-point conditions.
      this.sqrtAc[i] = Math.sqrt((0.45723553 * R_GAS * R_GAS * c.tcK * c.tcK) / c.pcPa);
      this.bi[i] = (0.07779607 * R_GAS * c.tcK) / c.pcPa;
      this.ci[i] = c.penelouxM3Mol;
      this.mi[i] = c.molarMassKgMol;
      const a = c.cp0;
      this.h0Ref[i] = 100 * t0 * (a[0] + t0 * (a[1] / 2 + t0 * (a[2] / 3 + t0 * (a[3] / 4 + (t0 * a[4]) / 5))));
      this.s0Ref[i] = a[0] * Math.log(t0) + t0 * (a[1] + t0 * (a[2] / 2 + t0 * (a[3] / 3 + (t0 * a[4]) / 4)));
      for (let j = 0; j < n; j++) {
        this.k0[i * n + j] = kij[i]?.[j] ?? 0;
        this.k1[i * n + j] = kijSlope?.[i]?.[j] ?? 0;
      }
    }
  }

  /** Molar mass of a composition, kg/mol. */
  molarMass(x: ArrayLike<number>): number {
    let m = 0;
    for (let i = 0; i < this.n; i++) m += x[i] * this.mi[i];
    return m;
  }

  /**
   * √a_i(T) = √a_c,i·(1 + Σ c_k·X^k), X = 1 − √(T/Tc) (Mathias–Copeman, here with five terms). Above Tc
   * only the c1 and c2 terms are kept: Mathias & Copeman keep c1 alone, which leaves a step in
   * d²α/dT² and so a 1 % step in cp at each component's Tc; with c2 the second derivative is
   * continuous and alpha stays monotone up to the 423 K limit (X ≥ −0.12 for the lowest Tc).
   */
  private setTemperature(tK: number): void {
    if (tK === this.cachedT) return;
    this.cachedT = tK;
    for (let p = 0; p < this.k0.length; p++) {
      this.oneMinusK[p] = 1 - this.k0[p] - (this.k1[p] * (tK - 280)) / 100;
      this.dOneMinusK[p] = -this.k1[p] / 100;
    }
    for (let i = 0; i < this.n; i++) {
      const c = this.components[i];
      const sq = Math.sqrt(tK / c.tcK);
      const X = 1 - sq;
      const dX = -0.5 / Math.sqrt(tK * c.tcK);
      const d2X = 0.25 / (Math.sqrt(c.tcK) * tK * Math.sqrt(tK));
      const mc = c.mc;
      let m: number;
      let dm: number;
      let d2m: number;
      if (X > 0) {
        // Horner for 1 + Σ c_k X^k and its first two X-derivatives.
        m = 0;
        dm = 0;
        d2m = 0;
        for (let k = mc.length - 1; k >= 0; k--) {
          d2m = d2m * X + 2 * dm;
          dm = dm * X + m;
          m = m * X + mc[k];
        }
        d2m = d2m * X + 2 * dm;
        dm = dm * X + m;
        m = m * X + 1;
      } else {
        m = 1 + X * (mc[0] + mc[1] * X);
        dm = mc[0] + 2 * mc[1] * X;
        d2m = 2 * mc[1];
      }
      const ac = this.sqrtAc[i];
      this.s[i] = ac * m;
      this.ds[i] = ac * dm * dX;
      this.d2s[i] = ac * (d2m * dX * dX + dm * d2X);
    }
  }

  /** Ideal-gas molar heat capacity of a composition, J/(mol·K). */
  cp0(tK: number, x: ArrayLike<number>): number {
    const tau = tK / 100;
    let cp = 0;
    for (let i = 0; i < this.n; i++) {
      const a = this.components[i].cp0;
      cp += x[i] * (a[0] + tau * (a[1] + tau * (a[2] + tau * (a[3] + tau * a[4]))));
    }
    return cp * R_GAS;
  }

  /**
   * Evaluate one phase of composition x at (T, P) on the chosen root. Fills `out` and, when
   * `withFugacity`, `this.lnPhi` (ln φ_i including the −P·c_i/RT shift of the translation).
   */
  evaluate(tK: number, pPa: number, x: ArrayLike<number>, root: RootKind, withFugacity: boolean, out: PhaseEval): void {
    this.setTemperature(tK);
    const n = this.n;
    let am = 0;
    let dam = 0;
    let d2am = 0;
    let bm = 0;
    let cm = 0;
    const s = this.s;
    const ds = this.ds;
    const d2s = this.d2s;
    const k = this.oneMinusK;
    const dk = this.dOneMinusK;
    for (let i = 0; i < n; i++) {
      const xi = x[i];
      bm += xi * this.bi[i];
      cm += xi * this.ci[i];
      let sa = 0;
      let sd2a = 0;
      let dka = 0;
      for (let j = 0; j < n; j++) {
        const f = x[j] * k[i * n + j];
        const g = x[j] * dk[i * n + j];
        sa += f * s[j];
        sd2a += f * (d2s[i] * s[j] + ds[i] * ds[j]);
        dka += g * s[j];
      }
      this.sumA[i] = s[i] * sa;
      am += xi * s[i] * sa;
      // (1−k)' terms: a' gains ΣΣ x x (1−k)' s_i s_j and a'' gains 4 ΣΣ x x (1−k)' s_i' s_j.
      dam += 2 * xi * ds[i] * sa + xi * s[i] * dka;
      d2am += 2 * xi * sd2a + 4 * xi * ds[i] * dka;
    }
    const RT = R_GAS * tK;
    const A = (am * pPa) / (RT * RT);
    const B = (bm * pPa) / RT;
    const z = cubicRoot(A, B, root);
    const v = (z * RT) / pPa;
    const lnTerm = Math.log((z + (1 + SQRT2) * B) / (z + (1 - SQRT2) * B));
    const inv2s2b = 1 / (2 * SQRT2 * bm);

    const tau = tK / 100;
    const lnTau = Math.log(tau);
    let h0 = 0;
    let s0 = 0;
    let cp0 = 0;
    let mix = 0;
    let mm = 0;
    for (let i = 0; i < n; i++) {
      const xi = x[i];
      if (xi <= 0) continue;
      const a = this.components[i].cp0;
      // ∫cp0 dT and ∫cp0/T dT of the polynomial in τ = T/100 K, from T0.
      const H = 100 * tau * (a[0] + tau * (a[1] / 2 + tau * (a[2] / 3 + tau * (a[3] / 4 + (tau * a[4]) / 5))));
      const S = a[0] * lnTau + tau * (a[1] + tau * (a[2] / 2 + tau * (a[3] / 3 + (tau * a[4]) / 4)));
      h0 += xi * (H - this.h0Ref[i]);
      s0 += xi * (S - this.s0Ref[i]);
      cp0 += xi * (a[0] + tau * (a[1] + tau * (a[2] + tau * (a[3] + tau * a[4]))));
      mix += xi * Math.log(xi);
      mm += xi * this.mi[i];
    }
    h0 *= R_GAS;
    s0 = R_GAS * (s0 - Math.log(pPa / P0_PA) - mix);
    cp0 *= R_GAS;

    const hRes = RT * (z - 1) + (tK * dam - am) * inv2s2b * lnTerm - pPa * cm;
    const sRes = R_GAS * Math.log(z - B) + dam * inv2s2b * lnTerm;
    const cvRes = tK * d2am * inv2s2b * lnTerm;
    const den = v * v + 2 * bm * v - bm * bm;
    const dPdT = R_GAS / (v - bm) - dam / den;
    const dPdv = -RT / ((v - bm) * (v - bm)) + (2 * am * (v + bm)) / (den * den);
    const cv = cp0 - R_GAS + cvRes;
    out.z = z;
    out.vM3Mol = v - cm;
    out.hJmol = h0 + hRes;
    out.sJmolK = s0 + sRes;
    out.cvJmolK = cv;
    out.cpJmolK = cv - (tK * dPdT * dPdT) / dPdv;
    out.dPdvT = dPdv;
    out.molarMassKgMol = mm;

    if (withFugacity) {
      const zm1 = z - 1;
      const lnZB = Math.log(z - B);
      // A/(2√2·B) = a/(2√2·b·RT)
      const f = ((am * inv2s2b) / RT) * lnTerm;
      for (let i = 0; i < n; i++) {
        const bib = this.bi[i] / bm;
        this.lnPhi[i] = bib * zm1 - lnZB - f * ((2 * this.sumA[i]) / am - bib) - (pPa * this.ci[i]) / RT;
      }
    }
  }
}

/** A fresh result holder for `evaluate`. */
export function newPhaseEval(): PhaseEval {
  return { z: 0, vM3Mol: 0, hJmol: 0, sJmolK: 0, cpJmolK: 0, cvJmolK: 0, dPdvT: 0, molarMassKgMol: 0 };
}

/**
 * Smallest (liquid) or largest (vapour) real root Z > B of the PR cubic
 * Z³ − (1−B)Z² + (A − 3B² − 2B)Z − (AB − B² − B³) = 0, by the trigonometric / Cardano
 * closed form, polished by one Newton step. Where only one real root exists it is returned
 * for both kinds.
 */
export function cubicRoot(A: number, B: number, root: RootKind): number {
  const a2 = -(1 - B);
  const a1 = A - 3 * B * B - 2 * B;
  const a0 = -(A * B - B * B - B * B * B);
  const Q = (a2 * a2 - 3 * a1) / 9;
  const Rr = (2 * a2 * a2 * a2 - 9 * a2 * a1 + 27 * a0) / 54;
  const Q3 = Q * Q * Q;
  let z: number;
  if (Rr * Rr < Q3) {
    const th = Math.acos(Rr / Math.sqrt(Q3));
    const sq = -2 * Math.sqrt(Q);
    const z1 = sq * Math.cos(th / 3) - a2 / 3;
    const z2 = sq * Math.cos((th + 2 * Math.PI) / 3) - a2 / 3;
    const z3 = sq * Math.cos((th - 2 * Math.PI) / 3) - a2 / 3;
    const zmax = Math.max(z1, z2, z3);
    if (root === VAPOUR_ROOT) z = zmax;
    else {
      // The smallest root above B (roots below B are unphysical).
      let zmin = zmax;
      if (z1 > B && z1 < zmin) zmin = z1;
      if (z2 > B && z2 < zmin) zmin = z2;
      if (z3 > B && z3 < zmin) zmin = z3;
      z = zmin;
    }
  } else {
    const Aa = -Math.sign(Rr) * Math.cbrt(Math.abs(Rr) + Math.sqrt(Rr * Rr - Q3));
    const Bb = Aa === 0 ? 0 : Q / Aa;
    z = Aa + Bb - a2 / 3;
  }
  const f = ((z + a2) * z + a1) * z + a0;
  const df = (3 * z + 2 * a2) * z + a1;
  if (df !== 0) z -= f / df;
  return z;
}
