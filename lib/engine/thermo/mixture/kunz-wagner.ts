/**
 * Multi-fluid Helmholtz-energy mixture model in the form of Kunz & Wagner (J. Chem. Eng. Data
 * 57, 3032–3091, 2012; the GERG-2008 framework, which Lemmon & Jacobsen 2004 use for the HFC
 * refrigerant mixtures):
 *
 *   α(ρ, T, x) = Σ x_i [α°_i(ρ/ρ_c,i, T_c,i/T) + ln x_i]                      (ideal part)
 *              + Σ x_i α^r_i(δ, τ) + Σ_{i<j} x_i x_j F_ij α^r_ij(δ, τ)         (residual part)
 *
 * with δ = ρ/ρ_r(x), τ = T_r(x)/T and the reducing functions
 *   T_r = Σ x_i² T_c,i + Σ_{i<j} 2 x_i x_j β_T γ_T (x_i + x_j)/(β_T² x_i + x_j) √(T_c,i T_c,j),
 *   v_r = Σ x_i² v_c,i + Σ_{i<j} 2 x_i x_j β_v γ_v (x_i + x_j)/(β_v² x_i + x_j) (v_c,i^⅓ + v_c,j^⅓)³/8.
 * Each α_i is the component's own reference equation (helmholtz/eos.ts), each α^r_ij a
 * published departure function (binary.ts). Fugacity coefficients use the exact composition
 * derivatives (Kunz & Wagner 2012, section 7.3):
 *   ln φ_i = α^r + n(∂α^r/∂n_i)_{T,V} − ln Z,
 *   n(∂α^r/∂n_i) = δα^r_δ [1 + n(∂v_r/∂n_i)/v_r] + τα^r_τ n(∂T_r/∂n_i)/T_r + α^r_{x_i} − Σ_k x_k α^r_{x_k},
 *   n(∂Y/∂n_i) = ∂Y/∂x_i − Σ_k x_k ∂Y/∂x_k.
 * Molar properties follow Span (2000), Table 3.3, with the mixture's α.
 *
 * The object keeps scratch arrays, so the hot loops allocate nothing.
 */
import { HelmholtzEos, newAlpha, type AlphaDerivs, type HelmholtzEosData } from "../helmholtz/eos";
import { reducingOf, type DepartureFunction } from "./binary";
import type { ComponentData, ComponentId } from "./component";

export type RootKind = 0 | 1;
export const LIQUID_ROOT: RootKind = 0;
export const VAPOUR_ROOT: RootKind = 1;

/** One phase evaluated at (T, P, x). Reused between calls (its density seeds the next solve). */
export interface PhaseEval {
  z: number;
  /** Molar density, mol/m³. */
  rhoMolM3: number;
  vM3Mol: number;
  hJmol: number;
  sJmolK: number;
  cpJmolK: number;
  cvJmolK: number;
  /** (∂P/∂v)_T in Pa·mol/m³. */
  dPdvT: number;
  speedOfSoundMs: number;
  molarMassKgMol: number;
  /** Root the density belongs to (−1 before the first solve). */
  root: number;
}

export function newPhaseEval(): PhaseEval {
  return { z: 0, rhoMolM3: 0, vM3Mol: 0, hJmol: 0, sJmolK: 0, cpJmolK: 0, cvJmolK: 0, dPdvT: 0, speedOfSoundMs: 0, molarMassKgMol: 0, root: -1 };
}

/** Constants the VLE starting guesses need, per component. */
export interface MixtureComponent {
  id: ComponentId;
  tcK: number;
  pcPa: number;
  omega: number;
  molarMassKgMol: number;
}

interface Pair {
  i: number;
  j: number;
  betaT: number;
  betaV: number;
  /** 2·β_T·γ_T·√(T_c,i T_c,j) */
  cT: number;
  /** 2·β_v·γ_v·(v_c,i^⅓ + v_c,j^⅓)³/8 */
  cV: number;
  F: number;
  dep?: CompiledDeparture;
  source: string;
}

interface CompiledDeparture {
  n: Float64Array;
  d: Float64Array;
  t: Float64Array;
  l: Int32Array;
  eta: Float64Array;
  eps: Float64Array;
  beta: Float64Array;
  gamma: Float64Array;
}

function compileDeparture(f: DepartureFunction): CompiledDeparture {
  return {
    n: Float64Array.from(f.n),
    d: Float64Array.from(f.d),
    t: Float64Array.from(f.t),
    l: Int32Array.from(f.l),
    eta: Float64Array.from(f.eta),
    eps: Float64Array.from(f.epsilon),
    beta: Float64Array.from(f.beta),
    gamma: Float64Array.from(f.gamma),
  };
}

/** Departure function n·δ^d·τ^t·exp(−δ^l − η(δ−ε)² − β(δ−γ)) and its reduced derivatives. */
function evalDeparture(c: CompiledDeparture, delta: number, tau: number, out: AlphaDerivs): void {
  const lnD = Math.log(delta);
  const lnT = Math.log(tau);
  let ar = 0,
    dAr = 0,
    ddAr = 0,
    tAr = 0,
    ttAr = 0,
    dtAr = 0;
  for (let k = 0; k < c.n.length; k++) {
    const d = c.d[k],
      t = c.t[k],
      l = c.l[k],
      eta = c.eta[k],
      beta = c.beta[k];
    const de = delta - c.eps[k];
    let g = -eta * de * de - beta * (delta - c.gamma[k]);
    // δG′ and δ²G″ of the exponent G(δ)
    let dG = -2 * eta * delta * de - beta * delta;
    let ddG = -2 * eta * delta * delta;
    if (l > 0) {
      const dl = Math.pow(delta, l);
      g -= dl;
      dG -= l * dl;
      ddG -= l * (l - 1) * dl;
    }
    const f = c.n[k] * Math.exp(d * lnD + t * lnT + g);
    const a = d + dG;
    ar += f;
    dAr += f * a;
    ddAr += f * (a * a - d + ddG);
    tAr += f * t;
    ttAr += f * t * (t - 1);
    dtAr += f * t * a;
  }
  out.ar = ar;
  out.dAr = dAr;
  out.ddAr = ddAr;
  out.tAr = tAr;
  out.ttAr = ttAr;
  out.dtAr = dtAr;
}

/** Residual part of the mixture at one (δ, τ, x), with the pieces the fugacities need. */
interface Residual {
  ar: number;
  dAr: number;
  ddAr: number;
  tAr: number;
  ttAr: number;
  dtAr: number;
}

export class MixtureModel {
  readonly n: number;
  readonly components: readonly MixtureComponent[];
  readonly pairs: readonly Pair[];
  /** ln φ_i of the last `evaluate` with fugacities. */
  readonly lnPhi: Float64Array;
  private readonly eos: HelmholtzEos[];
  private readonly tc: Float64Array;
  private readonly rhoc: Float64Array;
  private readonly vc: Float64Array;
  private readonly rGas: Float64Array;
  private readonly mi: Float64Array;
  // scratch
  private readonly a = newAlpha();
  private readonly arComp: Float64Array;
  private readonly arPair: Float64Array;
  private readonly dTr: Float64Array;
  private readonly dVr: Float64Array;
  private readonly res: Residual = { ar: 0, dAr: 0, ddAr: 0, tAr: 0, ttAr: 0, dtAr: 0 };
  private tr = 0;
  private vr = 0;

  private readonly data: readonly ComponentData[];

  constructor(data: readonly ComponentData[]) {
    const n = data.length;
    this.data = data;
    this.n = n;
    this.eos = data.map((c) => new HelmholtzEos(c.eos));
    this.tc = Float64Array.from(data, (c) => c.eos.tReducingK);
    this.rhoc = Float64Array.from(data, (c) => c.eos.rhoReducingKgM3 / c.eos.molarMassKgMol);
    this.vc = Float64Array.from(this.rhoc, (r) => 1 / r);
    this.rGas = Float64Array.from(data, (c) => c.eos.gasConstantJmolK);
    this.mi = Float64Array.from(data, (c) => c.eos.molarMassKgMol);
    this.components = data.map((c) => ({ id: c.id, tcK: c.eos.tReducingK, pcPa: c.criticalPressurePa, omega: c.omega, molarMassKgMol: c.eos.molarMassKgMol }));
    const pairs: Pair[] = [];
    for (let i = 0; i < n; i++) {
      for (let j = i + 1; j < n; j++) {
        const p = reducingOf(data[i].id, data[j].id, [this.tc[i], this.tc[j]], [this.vc[i], this.vc[j]]);
        const c = Math.cbrt(this.vc[i]) + Math.cbrt(this.vc[j]);
        pairs.push({
          i,
          j,
          betaT: p.betaT,
          betaV: p.betaV,
          cT: 2 * p.betaT * p.gammaT * Math.sqrt(this.tc[i] * this.tc[j]),
          cV: (2 * p.betaV * p.gammaV * c * c * c) / 8,
          F: p.F,
          dep: p.fn && p.F !== 0 ? compileDeparture(p.fn) : undefined,
          source: p.source,
        });
      }
    }
    this.pairs = pairs;
    this.lnPhi = new Float64Array(n);
    this.arComp = new Float64Array(n);
    this.arPair = new Float64Array(pairs.length);
    this.dTr = new Float64Array(n);
    this.dVr = new Float64Array(n);
  }

  /** The mixture at one fixed composition, compiled into one equation (single-phase states). */
  fixed(x: ArrayLike<number>): FixedMixture {
    return new FixedMixture(this, this.data, this.pairs, x);
  }

  /** Molar mass of a composition, kg/mol. */
  molarMass(x: ArrayLike<number>): number {
    let m = 0;
    for (let i = 0; i < this.n; i++) m += x[i] * this.mi[i];
    return m;
  }

  /** Molar gas constant of the mixture (mole-fraction average of the components' equations). */
  gasConstant(x: ArrayLike<number>): number {
    let r = 0;
    for (let i = 0; i < this.n; i++) r += x[i] * this.rGas[i];
    return r;
  }

  /**
   * Reducing temperature T_r (K) and molar volume v_r (m³/mol) of composition x; with
   * `derivs`, also ∂T_r/∂x_i and ∂v_r/∂x_i (mole fractions taken as independent) into scratch.
   */
  reducing(x: ArrayLike<number>, derivs: boolean): { tr: number; vr: number } {
    const n = this.n;
    let tr = 0;
    let vr = 0;
    for (let i = 0; i < n; i++) {
      tr += x[i] * x[i] * this.tc[i];
      vr += x[i] * x[i] * this.vc[i];
      if (derivs) {
        this.dTr[i] = 2 * x[i] * this.tc[i];
        this.dVr[i] = 2 * x[i] * this.vc[i];
      }
    }
    for (const p of this.pairs) {
      const xi = x[p.i];
      const xj = x[p.j];
      const s = xi + xj;
      // f = x_i x_j (x_i + x_j)/(β² x_i + x_j), for β_T and β_v
      const bt2 = p.betaT * p.betaT;
      const bv2 = p.betaV * p.betaV;
      const DT = bt2 * xi + xj;
      const DV = bv2 * xi + xj;
      if (DT > 0) tr += p.cT * ((xi * xj * s) / DT);
      if (DV > 0) vr += p.cV * ((xi * xj * s) / DV);
      if (derivs) {
        if (DT > 0) {
          this.dTr[p.i] += p.cT * ((xj * s) / DT + (xi * xj) / DT - (xi * xj * s * bt2) / (DT * DT));
          this.dTr[p.j] += p.cT * ((xi * s) / DT + (xi * xj) / DT - (xi * xj * s) / (DT * DT));
        }
        if (DV > 0) {
          this.dVr[p.i] += p.cV * ((xj * s) / DV + (xi * xj) / DV - (xi * xj * s * bv2) / (DV * DV));
          this.dVr[p.j] += p.cV * ((xi * s) / DV + (xi * xj) / DV - (xi * xj * s) / (DV * DV));
        }
      }
    }
    this.tr = tr;
    this.vr = vr;
    return { tr, vr };
  }

  /**
   * Residual Helmholtz energy α^r and its reduced derivatives at (δ, τ, x), into this.res;
   * per-component α^r_i and per-pair α^r_ij (values only) into scratch for fugacities.
   */
  private residual(delta: number, tau: number, x: ArrayLike<number>): Residual {
    const r = this.res;
    r.ar = r.dAr = r.ddAr = r.tAr = r.ttAr = r.dtAr = 0;
    const a = this.a;
    for (let i = 0; i < this.n; i++) {
      this.eos[i].evaluate(delta, tau, a, true);
      this.arComp[i] = a.ar;
      const xi = x[i];
      r.ar += xi * a.ar;
      r.dAr += xi * a.dAr;
      r.ddAr += xi * a.ddAr;
      r.tAr += xi * a.tAr;
      r.ttAr += xi * a.ttAr;
      r.dtAr += xi * a.dtAr;
    }
    for (let k = 0; k < this.pairs.length; k++) {
      const p = this.pairs[k];
      if (!p.dep) {
        this.arPair[k] = 0;
        continue;
      }
      evalDeparture(p.dep, delta, tau, a);
      this.arPair[k] = a.ar;
      const w = x[p.i] * x[p.j] * p.F;
      r.ar += w * a.ar;
      r.dAr += w * a.dAr;
      r.ddAr += w * a.ddAr;
      r.tAr += w * a.tAr;
      r.ttAr += w * a.ttAr;
      r.dtAr += w * a.dtAr;
    }
    return r;
  }

  /** α^r at molar density ρ (mol/m³), T (K), composition x (for checks of the derivatives). */
  alphaR(rhoMolM3: number, tK: number, x: ArrayLike<number>): number {
    const { tr, vr } = this.reducing(x, false);
    return this.residual(rhoMolM3 * vr, tr / tK, x).ar;
  }

  /** Pressure (Pa) at molar density ρ (mol/m³), T (K), composition x. */
  pressure(rhoMolM3: number, tK: number, x: ArrayLike<number>): number {
    const { tr, vr } = this.reducing(x, false);
    const r = this.residual(rhoMolM3 * vr, tr / tK, x);
    return rhoMolM3 * this.gasConstant(x) * tK * (1 + r.dAr);
  }

  /**
   * Molar density on the requested branch at (T, P, x): Newton's method on p(ρ) = P, from
   * above for liquid (p convex there, so the iterates stay above the root) and from below
   * for vapour (p concave); a start in the mechanically unstable region is moved out of it.
   * The reducing functions must already be set for x (`reducing`).
   */
  private density(tK: number, pPa: number, x: ArrayLike<number>, root: RootKind, guess: number): number {
    const rt = this.gasConstant(x) * tK;
    const vr = this.vr;
    const tau = this.tr / tK;
    const rhoR = 1 / vr;
    const solve = (start: number): number => {
      let rho = start;
      for (let it = 0; it < 200; it++) {
        const r = this.residual(rho * vr, tau, x);
        const p = rho * rt * (1 + r.dAr);
        const dp = rt * (1 + 2 * r.dAr + r.ddAr);
        if (!(dp > 0) || !Number.isFinite(p)) {
          rho = root === LIQUID_ROOT ? rho * 1.05 : rho * 0.9;
          continue;
        }
        let step = (p - pPa) / dp;
        if (step > 0.5 * rho) step = 0.5 * rho;
        if (step < -0.5 * rho) step = -0.5 * rho;
        rho -= step;
        // Newton converges quadratically here: after a step below 1e-9·ρ the iterate's error is
        // of order (1e-9)²·ρ, so no further evaluation is needed to confirm it
        if (Math.abs(step) < 1e-9 * rho) return rho;
      }
      return NaN;
    };
    const start = guess > 0 ? guess : root === LIQUID_ROOT ? 3.6 * rhoR : pPa / rt;
    let rho = solve(start);
    if (!Number.isFinite(rho) && guess > 0) rho = solve(root === LIQUID_ROOT ? 3.6 * rhoR : pPa / rt);
    if (!Number.isFinite(rho)) rho = solve(root === LIQUID_ROOT ? pPa / rt : 3.6 * rhoR);
    if (!Number.isFinite(rho)) throw new Error(`mixture density at T = ${tK} K, P = ${pPa} Pa did not converge`);
    return rho;
  }

  /**
   * One phase of composition x at (T, P) on the chosen branch: density, molar h, s, cp, cv,
   * (∂P/∂v)_T, speed of sound; with `withFugacity`, ln φ_i into `this.lnPhi`. The density in
   * `out` (when it belongs to the same branch) seeds the solve.
   */
  evaluate(tK: number, pPa: number, x: ArrayLike<number>, root: RootKind, withFugacity: boolean, out: PhaseEval): void {
    this.reducing(x, withFugacity);
    const guess = out.root === root && out.rhoMolM3 > 0 ? out.rhoMolM3 : 0;
    const rho = this.density(tK, pPa, x, root, guess);
    this.propertiesAt(rho, tK, x, out, withFugacity);
    out.root = root;
  }

  /** Properties at (ρ, T, x); the reducing functions must be set for x. */
  propertiesAt(rho: number, tK: number, x: ArrayLike<number>, out: PhaseEval, withFugacity = false): void {
    const n = this.n;
    const R = this.gasConstant(x);
    const delta = rho * this.vr;
    const tau = this.tr / tK;
    const r = this.residual(delta, tau, x);
    const a = this.a;
    // ideal part: Σ x_i [a0_i(τ_i) + ln(ρ/ρ_c,i) + ln x_i]
    let a0 = 0,
      tA0 = 0,
      ttA0 = 0;
    let m = 0;
    for (let i = 0; i < n; i++) {
      const xi = x[i];
      if (xi <= 0) continue;
      this.eos[i].evaluateIdeal(this.tc[i] / tK, a);
      a0 += xi * (a.a0 + Math.log(rho / this.rhoc[i]) + Math.log(xi));
      tA0 += xi * a.tA0;
      ttA0 += xi * a.ttA0;
      m += xi * this.mi[i];
    }
    const Z = 1 + r.dAr;
    const num = 1 + r.dAr - r.dtAr;
    const den = 1 + 2 * r.dAr + r.ddAr;
    const cvR = -(ttA0 + r.ttAr);
    out.z = Z;
    out.rhoMolM3 = rho;
    out.vM3Mol = 1 / rho;
    out.hJmol = R * tK * (1 + r.dAr + r.tAr + tA0);
    out.sJmolK = R * (tA0 + r.tAr - a0 - r.ar);
    out.cvJmolK = R * cvR;
    out.cpJmolK = R * (cvR + (num * num) / den);
    out.dPdvT = -rho * rho * R * tK * den;
    out.molarMassKgMol = m;
    out.speedOfSoundMs = Math.sqrt(Math.max(0, ((R * tK) / m) * (den + (num * num) / cvR)));
    if (withFugacity) this.fugacities(x, r, Z);
  }

  /** ln φ_i from the exact composition derivatives (see the module comment). */
  private fugacities(x: ArrayLike<number>, r: Residual, Z: number): void {
    const n = this.n;
    // α^r_{x_i} = α^r_i + Σ_{k≠i} x_k F_ik α^r_ik
    const ax = this.lnPhi; // reuse as scratch for α^r_{x_i}
    for (let i = 0; i < n; i++) ax[i] = this.arComp[i];
    for (let k = 0; k < this.pairs.length; k++) {
      const p = this.pairs[k];
      if (!p.dep) continue;
      const w = p.F * this.arPair[k];
      ax[p.i] += x[p.j] * w;
      ax[p.j] += x[p.i] * w;
    }
    let sAx = 0,
      sT = 0,
      sV = 0;
    for (let k = 0; k < n; k++) {
      sAx += x[k] * ax[k];
      sT += x[k] * this.dTr[k];
      sV += x[k] * this.dVr[k];
    }
    const lnZ = Math.log(Z);
    for (let i = 0; i < n; i++) {
      const ndv = this.dVr[i] - sV;
      const ndt = this.dTr[i] - sT;
      const nda = r.dAr * (1 + ndv / this.vr) + (r.tAr * ndt) / this.tr + ax[i] - sAx;
      this.lnPhi[i] = r.ar + nda - lnZ;
    }
  }
}

/**
 * The mixture at one fixed composition (a blend's overall composition): the reducing
 * functions are constants, so α^r becomes one sum of terms in (δ, τ). The components'
 * power, Gaussian and non-analytic terms are merged, each coefficient multiplied by x_i, and
 * the exponential-form departure functions by x_i·x_j·F_ij, into one equation that the pure
 * fluids' evaluator runs; the GERG-form departure functions (an exp(−β·δ) factor that evaluator
 * has no term for) are evaluated beside it. The single-phase states of a blend use this.
 */
export class FixedMixture {
  readonly tr: number;
  readonly vr: number;
  /** Molar gas constant, J/(mol·K). */
  readonly r: number;
  readonly molarMassKgMol: number;
  private readonly eos: HelmholtzEos;
  private readonly deps: { dep: CompiledDeparture; w: number }[];
  private readonly ideal: { eos: HelmholtzEos; x: number; tc: number; rhoc: number }[];
  private readonly mixTerm: number;
  private readonly a = newAlpha();
  private readonly b = newAlpha();

  constructor(model: MixtureModel, components: readonly ComponentData[], pairs: readonly Pair[], x: ArrayLike<number>) {
    const { tr, vr } = model.reducing(x, false);
    this.tr = tr;
    this.vr = vr;
    this.r = model.gasConstant(x);
    this.molarMassKgMol = model.molarMass(x);
    const pw = { n: [] as number[], d: [] as number[], t: [] as number[], l: [] as number[], m: [] as number[] };
    const gs = { n: [] as number[], d: [] as number[], t: [] as number[], eta: [] as number[], epsilon: [] as number[], beta: [] as number[], gamma: [] as number[] };
    const na = { n: [] as number[], a: [] as number[], b: [] as number[], beta: [] as number[], A: [] as number[], B: [] as number[], C: [] as number[], D: [] as number[] };
    components.forEach((c, i) => {
      const w = x[i];
      const e = c.eos;
      if (e.power) {
        e.power.n.forEach((v, k) => {
          pw.n.push(w * v);
          pw.d.push(e.power!.d[k]);
          pw.t.push(e.power!.t[k]);
          pw.l.push(e.power!.l[k]);
          pw.m.push(e.power!.m?.[k] ?? 0);
        });
      }
      if (e.gaussian) {
        const g = e.gaussian;
        g.n.forEach((v, k) => {
          gs.n.push(w * v);
          gs.d.push(g.d[k]);
          gs.t.push(g.t[k]);
          gs.eta.push(g.eta[k]);
          gs.epsilon.push(g.epsilon[k]);
          gs.beta.push(g.beta[k]);
          gs.gamma.push(g.gamma[k]);
        });
      }
      if (e.nonAnalytic) {
        const q = e.nonAnalytic;
        q.n.forEach((v, k) => {
          na.n.push(w * v);
          na.a.push(q.a[k]);
          na.b.push(q.b[k]);
          na.beta.push(q.beta[k]);
          na.A.push(q.A[k]);
          na.B.push(q.B[k]);
          na.C.push(q.C[k]);
          na.D.push(q.D[k]);
        });
      }
    });
    this.deps = [];
    for (const p of pairs) {
      if (!p.dep) continue;
      const w = x[p.i] * x[p.j] * p.F;
      const d = p.dep;
      const exponentialOnly = d.eta.every((v) => v === 0) && d.beta.every((v) => v === 0);
      if (exponentialOnly) {
        d.n.forEach((v, k) => {
          pw.n.push(w * v);
          pw.d.push(d.d[k]);
          pw.t.push(d.t[k]);
          pw.l.push(d.l[k]);
          pw.m.push(0);
        });
      } else {
        this.deps.push({ dep: d, w });
      }
    }
    const data: HelmholtzEosData = {
      tReducingK: tr,
      rhoReducingKgM3: this.molarMassKgMol / vr,
      gasConstantJmolK: this.r,
      molarMassKgMol: this.molarMassKgMol,
      ideal: { a1: 0, a2: 0, logTau: 0 },
      power: pw,
      gaussian: gs.n.length ? gs : undefined,
      nonAnalytic: na.n.length ? na : undefined,
    };
    this.eos = new HelmholtzEos(data);
    this.ideal = components
      .map((c, i) => ({ eos: new HelmholtzEos(c.eos), x: x[i], tc: c.eos.tReducingK, rhoc: c.eos.rhoReducingKgM3 / c.eos.molarMassKgMol }))
      .filter((c) => c.x > 0);
    let mixTerm = 0;
    for (const c of this.ideal) mixTerm += c.x * (Math.log(c.x) - Math.log(c.rhoc));
    this.mixTerm = mixTerm;
  }

  /** α^r and its reduced derivatives at (δ, τ) into `out`. */
  residual(delta: number, tau: number, out: AlphaDerivs): AlphaDerivs {
    this.eos.evaluate(delta, tau, out, true);
    if (this.deps.length) {
      const b = this.b;
      for (const { dep, w } of this.deps) {
        evalDeparture(dep, delta, tau, b);
        out.ar += w * b.ar;
        out.dAr += w * b.dAr;
        out.ddAr += w * b.ddAr;
        out.tAr += w * b.tAr;
        out.ttAr += w * b.ttAr;
        out.dtAr += w * b.dtAr;
      }
    }
    return out;
  }

  /** Ideal part Σ x_i [a0_i(τ_i) + ln x_i − ln ρ_c,i] (without Σ x_i ln ρ) and its T-derivatives, into out.a0/tA0/ttA0. */
  idealPart(tK: number, out: AlphaDerivs): void {
    let a0 = this.mixTerm,
      tA0 = 0,
      ttA0 = 0;
    const b = this.b;
    for (const c of this.ideal) {
      c.eos.evaluateIdeal(c.tc / tK, b);
      a0 += c.x * b.a0;
      tA0 += c.x * b.tA0;
      ttA0 += c.x * b.ttA0;
    }
    out.a0 = a0;
    out.tA0 = tA0;
    out.ttA0 = ttA0;
  }

  /**
   * Density (mol/m³) on a branch at (T, P): Newton on p(ρ) = P from `guess` (or from above for
   * liquid, from the ideal gas for vapour), as in `MixtureModel`.
   */
  density(tK: number, pPa: number, root: RootKind, guess: number): number {
    const rt = this.r * tK;
    const tau = this.tr / tK;
    const a = this.a;
    const solve = (start: number): number => {
      let rho = start;
      for (let it = 0; it < 200; it++) {
        this.residual(rho * this.vr, tau, a);
        const p = rho * rt * (1 + a.dAr);
        const dp = rt * (1 + 2 * a.dAr + a.ddAr);
        if (!(dp > 0) || !Number.isFinite(p)) {
          rho = root === LIQUID_ROOT ? rho * 1.05 : rho * 0.9;
          continue;
        }
        let step = (p - pPa) / dp;
        if (step > 0.5 * rho) step = 0.5 * rho;
        if (step < -0.5 * rho) step = -0.5 * rho;
        rho -= step;
        if (Math.abs(step) < 1e-13 * rho) return rho;
      }
      return NaN;
    };
    const cold = root === LIQUID_ROOT ? 3.6 / this.vr : pPa / rt;
    let rho = guess > 0 ? solve(guess) : NaN;
    if (!Number.isFinite(rho)) rho = solve(cold);
    if (!Number.isFinite(rho)) throw new Error(`blend density at T = ${tK} K, P = ${pPa} Pa did not converge`);
    return rho;
  }

  /**
   * State functions at (ρ, T) with the derivatives a (P, h) or (P, s) Newton step needs:
   * p, (∂p/∂ρ)_T, (∂p/∂T)_ρ, h, (∂h/∂ρ)_T, (∂h/∂T)_ρ, s, (∂s/∂ρ)_T, (∂s/∂T)_ρ, cp, cv, w.
   * Molar units; Span (2000) Table 3.3.
   */
  at(rho: number, tK: number, out: FixedState): FixedState {
    const R = this.r;
    const delta = rho * this.vr;
    const tau = this.tr / tK;
    const a = this.residual(delta, tau, this.a);
    this.idealPart(tK, a);
    const rt = R * tK;
    const num = 1 + a.dAr - a.dtAr;
    const den = 1 + 2 * a.dAr + a.ddAr;
    const cvR = -(a.ttA0 + a.ttAr);
    out.rho = rho;
    out.tK = tK;
    out.p = rho * rt * (1 + a.dAr);
    out.dpdrho = rt * den;
    out.dpdT = rho * R * num;
    out.h = rt * (1 + a.dAr + a.tAr + a.tA0);
    out.dhdrho = (rt * (a.dtAr + a.dAr + a.ddAr)) / rho;
    out.dhdT = R * (cvR + num);
    out.s = R * (a.tA0 + a.tAr - a.a0 - Math.log(rho) - a.ar);
    out.dsdrho = (-R * num) / rho;
    out.dsdT = (R * cvR) / tK;
    out.cv = R * cvR;
    out.cp = R * (cvR + (num * num) / den);
    out.w = Math.sqrt(Math.max(0, (rt / this.molarMassKgMol) * (den + (num * num) / cvR)));
    return out;
  }
}

export interface FixedState {
  rho: number;
  tK: number;
  p: number;
  dpdrho: number;
  dpdT: number;
  h: number;
  dhdrho: number;
  dhdT: number;
  s: number;
  dsdrho: number;
  dsdT: number;
  cp: number;
  cv: number;
  w: number;
}

export function newFixedState(): FixedState {
  return { rho: 0, tK: 0, p: 0, dpdrho: 0, dpdT: 0, h: 0, dhdrho: 0, dhdT: 0, s: 0, dsdrho: 0, dsdT: 0, cp: 0, cv: 0, w: 0 };
}

/** Builds the mixture model of the given components (order kept). */
export function createMixture(components: readonly ComponentData[]): MixtureModel {
  return new MixtureModel(components);
}
