/**
 * A pure fluid on a multiparameter Helmholtz equation of state, behind the `Fluid` contract:
 * density from (P,T), saturation by the Maxwell criterion, (P,h) and (P,s) flashes, cp and
 * speed of sound, the IIR reference state applied by offsets, and an explicit validity range.
 *
 * Speed: on creation the Maxwell solution is tabulated once on a grid uniform in
 * u = √(T_c − T) (saturation properties are smooth in u up to the critical point for an
 * analytic equation) and read back by 4-point Lagrange interpolation; `maxwellAtT` gives the
 * full solve, and the tests check the table against it.
 */
import type {
  Fluid,
  FluidMeta,
  Phase,
  PhaseProps,
  SaturationState,
  State,
  ValidityRange,
} from "../types";
import { ThermoRangeError } from "../types";
import { evalAncillary, type Ancillary } from "./ancillary";
import { HelmholtzEos, newAlpha, type HelmholtzEosData } from "./eos";

export interface PureFluidData {
  meta: FluidMeta;
  eos: HelmholtzEosData;
  range: ValidityRange;
  ancillaries: { rhoL: Ancillary; rhoV: Ancillary };
  /** Grid size of the saturation table (default 1000). */
  satTablePoints?: number;
}

/** Raw Maxwell solution (equation's own reference state). */
export interface MaxwellSolution {
  tK: number;
  pPa: number;
  rhoL: number;
  rhoV: number;
}

// columns of the saturation table
const C_LNP = 0,
  C_RL = 1,
  /** ln ρ'' (spans decades at low T) */
  C_RV = 2,
  C_HL = 3,
  C_HV = 4,
  C_SL = 5,
  C_SV = 6,
  C_CPL = 7,
  C_CPV = 8,
  C_WL = 9,
  C_WV = 10,
  NCOL = 11;

/** Closest approach to the critical temperature that the saturation table attempts, K. */
const CRIT_MARGIN_K = 0.02;

interface RawProps {
  pPa: number;
  hJkg: number;
  sJkgK: number;
  cpJkgK: number;
  wMs: number;
  /** ∂p/∂ρ at constant T */
  dpdrho: number;
  /** ∂p/∂T at constant ρ */
  dpdT: number;
}

export class HelmholtzFluid implements Fluid {
  readonly meta: FluidMeta;
  readonly range: ValidityRange;
  readonly eos: HelmholtzEos;
  /** Highest temperature of the saturation table (a few hundredths of a kelvin below T_c). */
  readonly tSatMaxK: number;
  readonly pSatMinPa: number;
  readonly pSatMaxPa: number;
  /** Offsets that move the equation's reference state to IIR. */
  readonly hOffsetJkg: number;
  readonly sOffsetJkgK: number;

  private readonly al = newAlpha();
  private readonly tc: number;
  private readonly pc: number;
  private readonly uMin: number;
  private readonly du: number;
  private readonly nPts: number;
  private readonly table: Float64Array;
  private readonly rhoMaxKgM3: number;
  private readonly w = new Float64Array(4);

  constructor(data: PureFluidData) {
    this.meta = data.meta;
    this.range = data.range;
    this.eos = new HelmholtzEos(data.eos);
    this.tc = data.meta.criticalTempK;
    this.pc = data.meta.criticalPressurePa;
    const n = data.satTablePoints ?? 1000;
    this.uMin = Math.sqrt(CRIT_MARGIN_K);
    const uMax = Math.sqrt(this.tc - data.range.tMinK);
    this.du = (uMax - this.uMin) / (n - 1);
    // March from the cold end towards the critical point, each solve seeded by the last two.
    const rows: number[][] = [];
    let prev: MaxwellSolution | null = null;
    let prev2: MaxwellSolution | null = null;
    for (let i = n - 1; i >= 0; i--) {
      const u = i === n - 1 ? uMax : this.uMin + i * this.du;
      const tK = i === n - 1 ? data.range.tMinK : this.tc - u * u;
      let gl: number, gv: number;
      if (prev && prev2) {
        // linear extrapolation in u of ρ' and ln ρ''
        const u1 = Math.sqrt(this.tc - prev.tK);
        const u2 = Math.sqrt(this.tc - prev2.tK);
        const f = (u - u1) / (u1 - u2);
        gl = prev.rhoL + f * (prev.rhoL - prev2.rhoL);
        gv = Math.exp(Math.log(prev.rhoV) + f * (Math.log(prev.rhoV) - Math.log(prev2.rhoV)));
      } else if (prev) {
        gl = prev.rhoL;
        gv = prev.rhoV;
      } else {
        gl = evalAncillary(data.ancillaries.rhoL, tK);
        gv = evalAncillary(data.ancillaries.rhoV, tK);
      }
      const sol = this.maxwellSolve(tK, gl, gv);
      if (!sol) {
        if (rows.length < 10) throw new Error(`${data.meta.id}: saturation solve failed at ${tK} K`);
        break;
      }
      const l = this.raw(sol.rhoL, tK);
      const v = this.raw(sol.rhoV, tK);
      rows.push([Math.log(sol.pPa), sol.rhoL, Math.log(sol.rhoV), l.hJkg, v.hJkg, l.sJkgK, v.sJkgK, l.cpJkgK, v.cpJkgK, l.wMs, v.wMs]);
      prev2 = prev;
      prev = sol;
    }
    // rows run cold → warm; the table is indexed by grid index i (0 = warmest)
    const m = rows.length;
    this.nPts = m;
    this.table = new Float64Array(m * NCOL);
    const first = n - m; // grid index of the warmest converged row
    for (let k = 0; k < m; k++) {
      const i = n - 1 - k - first;
      for (let c = 0; c < NCOL; c++) this.table[i * NCOL + c] = rows[k][c];
    }
    this.uMin = this.uMin + first * this.du;
    this.tSatMaxK = this.tc - this.uMin * this.uMin;
    // the cold end sits exactly on tMin (grid point n−1)
    this.pSatMinPa = Math.exp(this.table[(m - 1) * NCOL + C_LNP]);
    this.pSatMaxPa = Math.exp(this.table[C_LNP]);
    // IIR reference: h = 200 kJ/kg, s = 1 kJ/(kg·K) for saturated liquid at 0 °C.
    const ref = this.maxwellAtT(273.15);
    const lref = this.raw(ref.rhoL, 273.15);
    this.hOffsetJkg = 200e3 - lref.hJkg;
    this.sOffsetJkgK = 1e3 - lref.sJkgK;
    this.rhoMaxKgM3 = 1.3 * this.table[(m - 1) * NCOL + C_RL];
  }

  // ---------------------------------------------------------------- equation of state

  /** Pressure (Pa) at density ρ (kg/m³) and temperature T (K), from p = ρRT(1 + δ·αʳ_δ). */
  pressure(rhoKgM3: number, tK: number): number {
    const e = this.eos;
    const a = e.evaluate(rhoKgM3 / e.rhor, e.tr / tK, this.al);
    return rhoKgM3 * e.r * tK * (1 + a.dAr);
  }

  /** Raw properties (equation's reference state) at (ρ, T); Span (2000) Table 3.3. */
  raw(rhoKgM3: number, tK: number): RawProps {
    const e = this.eos;
    const a = e.evaluate(rhoKgM3 / e.rhor, e.tr / tK, this.al);
    const rt = e.r * tK;
    const cvR = -(a.ttA0 + a.ttAr);
    const num = 1 + a.dAr - a.dtAr;
    const den = 1 + 2 * a.dAr + a.ddAr;
    return {
      pPa: rhoKgM3 * rt * (1 + a.dAr),
      hJkg: rt * (1 + a.tA0 + a.tAr + a.dAr),
      sJkgK: e.r * (a.tA0 + a.tAr - a.a0 - Math.log(rhoKgM3 / e.rhor) - a.ar),
      cpJkgK: e.r * (cvR + (num * num) / den),
      wMs: Math.sqrt(Math.max(0, rt * (den + (num * num) / cvR))),
      dpdrho: rt * den,
      dpdT: rhoKgM3 * e.r * num,
    };
  }

  /**
   * Maxwell criterion (equal pressure and Gibbs energy of both phases) at T, solved by the
   * Newton scheme of Akasaka (2008, J. Thermal Sci. Tech. 3, 442) in (δ', δ'').
   * Returns null when it does not converge to two distinct phases.
   */
  maxwellSolve(tK: number, rhoLGuess: number, rhoVGuess: number): MaxwellSolution | null {
    const e = this.eos;
    const tau = e.tr / tK;
    let dl = rhoLGuess / e.rhor;
    let dv = rhoVGuess / e.rhor;
    const a = this.al;
    for (let it = 0; it < 100; it++) {
      e.evaluate(dl, tau, a);
      const jl = dl * (1 + a.dAr);
      const kl = a.dAr + a.ar + Math.log(dl);
      const jdl = 1 + 2 * a.dAr + a.ddAr;
      const kdl = (2 * a.dAr + a.ddAr + 1) / dl;
      e.evaluate(dv, tau, a);
      const jv = dv * (1 + a.dAr);
      const kv = a.dAr + a.ar + Math.log(dv);
      const jdv = 1 + 2 * a.dAr + a.ddAr;
      const kdv = (2 * a.dAr + a.ddAr + 1) / dv;
      const det = jdv * kdl - jdl * kdv;
      if (!Number.isFinite(det) || det === 0) return null;
      let stepL = ((kv - kl) * jdv - (jv - jl) * kdv) / det;
      let stepV = ((kv - kl) * jdl - (jv - jl) * kdl) / det;
      // damp steps that would leave the physical ordering 0 < δ'' < δ'
      let g = 1;
      while (g > 1e-4 && !(dv + g * stepV > 0 && dl + g * stepL > dv + g * stepV)) g *= 0.5;
      stepL *= g;
      stepV *= g;
      dl += stepL;
      dv += stepV;
      const rel = Math.abs(stepL / dl) + Math.abs(stepV / dv);
      if (rel < 1e-12) break;
      // near T_c the Newton matrix is ill-conditioned and the steps stall at round-off level
      if (it === 99) {
        if (rel < 1e-9) break;
        return null;
      }
    }
    if (!(dl > dv * (1 + 1e-6)) || !Number.isFinite(dl) || !Number.isFinite(dv)) {
      return null;
    }
    const rhoL = dl * e.rhor;
    const rhoV = dv * e.rhor;
    const pl = this.pressure(rhoL, tK);
    const pv = this.pressure(rhoV, tK);
    // pressure agreement on the scale of ρ'RT: at very low T the vapour pressure is a tiny
    // difference of large liquid-side terms
    if (!(Math.abs(pl - pv) <= 1e-8 * Math.abs(pv) + 1e-11 * rhoL * e.r * tK)) {
      return null;
    }
    return { tK, pPa: pv, rhoL, rhoV };
  }

  /** Full Maxwell solve at T, seeded from the saturation table (the table's reference). */
  maxwellAtT(tK: number): MaxwellSolution {
    this.checkSatT(tK);
    const i = this.weights(tK);
    const sol = this.maxwellSolve(tK, this.col(i, C_RL), Math.exp(this.col(i, C_RV)));
    if (!sol) throw new Error(`${this.meta.id}: Maxwell solve failed at ${tK} K`);
    return sol;
  }

  // ------------------------------------------------------------------ saturation table

  /** Lagrange weights for temperature tK into this.w; returns the first row index. */
  private weights(tK: number): number {
    const u = Math.sqrt(this.tc - tK);
    return this.weightsU((u - this.uMin) / this.du);
  }

  private weightsU(x: number): number {
    let i = Math.floor(x) - 1;
    if (i < 0) i = 0;
    if (i > this.nPts - 4) i = this.nPts - 4;
    const t = x - i; // nodes at 0,1,2,3
    const w = this.w;
    w[0] = (-(t - 1) * (t - 2) * (t - 3)) / 6;
    w[1] = (t * (t - 2) * (t - 3)) / 2;
    w[2] = (-t * (t - 1) * (t - 3)) / 2;
    w[3] = (t * (t - 1) * (t - 2)) / 6;
    return i;
  }

  private col(i: number, c: number): number {
    const tb = this.table;
    const w = this.w;
    return (
      w[0] * tb[i * NCOL + c] +
      w[1] * tb[(i + 1) * NCOL + c] +
      w[2] * tb[(i + 2) * NCOL + c] +
      w[3] * tb[(i + 3) * NCOL + c]
    );
  }

  private satFromWeights(i: number, tK: number): SaturationState {
    const pPa = Math.exp(this.col(i, C_LNP));
    const liquid: PhaseProps = {
      tK,
      pPa,
      densityKgM3: this.col(i, C_RL),
      hJkg: this.col(i, C_HL) + this.hOffsetJkg,
      sJkgK: this.col(i, C_SL) + this.sOffsetJkgK,
      cpJkgK: this.col(i, C_CPL),
      speedOfSoundMs: this.col(i, C_WL),
    };
    const vapour: PhaseProps = {
      tK,
      pPa,
      densityKgM3: Math.exp(this.col(i, C_RV)),
      hJkg: this.col(i, C_HV) + this.hOffsetJkg,
      sJkgK: this.col(i, C_SV) + this.sOffsetJkgK,
      cpJkgK: this.col(i, C_CPV),
      speedOfSoundMs: this.col(i, C_WV),
    };
    return { tBubbleK: tK, tDewK: tK, pBubblePa: pPa, pDewPa: pPa, liquid, vapour, glideK: 0 };
  }

  private checkSatT(tK: number): void {
    if (!(tK >= this.range.tMinK && tK <= this.tSatMaxK)) {
      throw new ThermoRangeError(
        `${this.meta.id}: saturation temperature ${tK} K outside ${this.range.tMinK}…${this.tSatMaxK.toFixed(3)} K`,
        "tK",
        { min: this.range.tMinK, max: this.tSatMaxK, unit: "K" },
      );
    }
  }

  private checkSatP(pPa: number): void {
    if (!(pPa >= this.pSatMinPa && pPa <= this.pSatMaxPa)) {
      throw new ThermoRangeError(
        `${this.meta.id}: saturation pressure ${pPa} Pa outside ${this.pSatMinPa.toPrecision(6)}…${this.pSatMaxPa.toPrecision(6)} Pa`,
        "pPa",
        { min: this.pSatMinPa, max: this.pSatMaxPa, unit: "Pa" },
      );
    }
  }

  /**
   * Saturation at temperature tK (K), from the tabulated Maxwell solution. Pure fluid: bubble
   * and dew coincide, `convention` has no effect. IIR reference state.
   */
  saturationAtT(tK: number): SaturationState {
    this.checkSatT(tK);
    return this.satFromWeights(this.weights(tK), tK);
  }

  /** Saturation temperature (K) at pressure pPa: inverse of the tabulated ln p(T). */
  private tSatAt(pPa: number): { i: number; tK: number } {
    const lnp = Math.log(pPa);
    const tb = this.table;
    // ln p falls with the row index (row 0 is the warmest)
    let lo = 0,
      hi = this.nPts - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (tb[mid * NCOL + C_LNP] > lnp) lo = mid;
      else hi = mid;
    }
    const y0 = tb[lo * NCOL + C_LNP];
    const y1 = tb[hi * NCOL + C_LNP];
    let x = lo + (lnp - y0) / (y1 - y0);
    let i = 0;
    for (let it = 0; it < 6; it++) {
      i = this.weightsU(x);
      const f = this.col(i, C_LNP) - lnp;
      // derivative of the cubic interpolant by a small central difference in x
      const h = 1e-4;
      this.weightsU(x + h);
      const fp = this.col(i, C_LNP);
      this.weightsU(x - h);
      const fm = this.col(i, C_LNP);
      const dx = -f / ((fp - fm) / (2 * h));
      x += dx;
      if (Math.abs(dx) < 1e-12) break;
    }
    i = this.weightsU(x);
    const u = this.uMin + x * this.du;
    return { i, tK: Math.min(this.tSatMaxK, Math.max(this.range.tMinK, this.tc - u * u)) };
  }

  /** Saturation at pressure pPa (Pa). IIR reference state. */
  saturationAtP(pPa: number): SaturationState {
    this.checkSatP(pPa);
    const { i, tK } = this.tSatAt(pPa);
    const s = this.satFromWeights(i, tK);
    // report the requested pressure exactly (the interpolant matches it to ~1e-12)
    s.pBubblePa = s.pDewPa = s.liquid.pPa = s.vapour.pPa = pPa;
    return s;
  }

  // ------------------------------------------------------------------ single phase

  private checkP(pPa: number): void {
    if (!(pPa > 0 && pPa <= this.range.pMaxPa)) {
      throw new ThermoRangeError(
        `${this.meta.id}: pressure ${pPa} Pa outside 0…${this.range.pMaxPa} Pa`,
        "pPa",
        { min: 0, max: this.range.pMaxPa, unit: "Pa" },
      );
    }
  }

  private checkT(tK: number): void {
    if (!(tK >= this.range.tMinK && tK <= this.range.tMaxK)) {
      throw new ThermoRangeError(
        `${this.meta.id}: temperature ${tK} K outside ${this.range.tMinK}…${this.range.tMaxK} K`,
        "tK",
        { min: this.range.tMinK, max: this.range.tMaxK, unit: "K" },
      );
    }
  }

  /**
   * Density (kg/m³) at (P, T) on the stable branch: below the saturation table's top the
   * phase follows from P vs p_sat(T) and the root is bracketed between the saturated density
   * and zero (vapour) or a high bound (liquid); above it, between zero and the high bound.
   * Safeguarded Newton (bisection when a step leaves the bracket).
   */
  densityPT(pPa: number, tK: number, guess?: number): number {
    let lo: number, hi: number, rho: number;
    if (tK <= this.tSatMaxK) {
      const i = this.weights(tK);
      const psat = Math.exp(this.col(i, C_LNP));
      if (pPa >= psat) {
        const rl = this.col(i, C_RL);
        lo = rl * (1 - 1e-7);
        hi = this.rhoMaxKgM3;
        rho = guess !== undefined && guess > lo ? guess : rl * (1 + 1e-6);
      } else {
        const rv = Math.exp(this.col(i, C_RV));
        lo = 0;
        hi = rv * (1 + 1e-7);
        rho = guess !== undefined && guess < hi ? guess : rv * (pPa / psat);
      }
    } else {
      lo = 0;
      hi = this.rhoMaxKgM3;
      rho = guess ?? Math.min(pPa / (this.eos.r * tK), 0.9 * hi);
    }
    if (!(rho > lo && rho < hi)) rho = 0.5 * (lo + hi);
    const e = this.eos;
    const tau = e.tr / tK;
    const rt = e.r * tK;
    const a = this.al;
    for (let it = 0; it < 100; it++) {
      e.evaluate(rho / e.rhor, tau, a, true);
      const f = rho * rt * (1 + a.dAr) - pPa;
      if (Math.abs(f) <= 1e-12 * pPa) return rho;
      if (f > 0) hi = rho;
      else lo = rho;
      const dp = rt * (1 + 2 * a.dAr + a.ddAr);
      let next = rho - f / dp;
      if (!(next > lo && next < hi) || !(dp > 0)) next = 0.5 * (lo + hi);
      if (Math.abs(next - rho) <= 1e-13 * rho) return next;
      rho = next;
    }
    return rho;
  }

  private phaseOf(pPa: number, tK: number, rho: number): Phase {
    if (pPa >= this.pc && tK >= this.tc) return "supercritical";
    if (tK >= this.tc) return "vapour";
    if (pPa >= this.pc) return "liquid";
    return rho > this.meta.criticalDensityKgM3 ? "liquid" : "vapour";
  }

  private stateAt(pPa: number, tK: number, rho: number): State {
    const r = this.raw(rho, tK);
    return {
      tK,
      pPa,
      densityKgM3: rho,
      hJkg: r.hJkg + this.hOffsetJkg,
      sJkgK: r.sJkgK + this.sOffsetJkgK,
      cpJkgK: r.cpJkgK,
      speedOfSoundMs: r.wMs,
      phase: this.phaseOf(pPa, tK, rho),
    };
  }

  /** Single-phase state at (P, T): density from the EOS, then h, s, cp, w. IIR reference. */
  statePT(pPa: number, tK: number): State {
    this.checkP(pPa);
    this.checkT(tK);
    return this.stateAt(pPa, tK, this.densityPT(pPa, tK));
  }

  /** State at (P, h): two-phase with quality inside the dome, else a T solve on the isobar. */
  statePH(pPa: number, hJkg: number): State {
    return this.flash(pPa, hJkg, false);
  }

  /** State at (P, s): two-phase with quality inside the dome, else a T solve on the isobar. */
  statePS(pPa: number, sJkgK: number): State {
    return this.flash(pPa, sJkgK, true);
  }

  private flash(pPa: number, target: number, isS: boolean): State {
    this.checkP(pPa);
    const field = isS ? "sJkgK" : "hJkg";
    if (!Number.isFinite(target)) {
      throw new ThermoRangeError(`${this.meta.id}: ${field} must be a finite number`, field, {
        unit: isS ? "J/(kg·K)" : "J/kg",
      });
    }
    const raw = target - (isS ? this.sOffsetJkgK : this.hOffsetJkg);
    let tLo = this.range.tMinK;
    let tHi = this.range.tMaxK;
    let tGuess: number;
    let rhoGuess: number | undefined;
    if (pPa >= this.pSatMinPa && pPa < this.pSatMaxPa) {
      const { i, tK } = this.tSatAt(pPa);
      const yl = this.col(i, isS ? C_SL : C_HL);
      const yv = this.col(i, isS ? C_SV : C_HV);
      // a hair of tolerance so that saturated states given exactly (x = 0 or 1) stay on the dome
      const eps = 1e-9 * (yv - yl);
      if (raw >= yl - eps && raw <= yv + eps) {
        const x = Math.min(1, Math.max(0, (raw - yl) / (yv - yl)));
        const vl = 1 / this.col(i, C_RL);
        const vv = Math.exp(-this.col(i, C_RV));
        const hl = this.col(i, C_HL),
          hv = this.col(i, C_HV),
          sl = this.col(i, C_SL),
          sv = this.col(i, C_SV);
        return {
          tK,
          pPa,
          densityKgM3: 1 / (vl + x * (vv - vl)),
          hJkg: hl + x * (hv - hl) + this.hOffsetJkg,
          sJkgK: sl + x * (sv - sl) + this.sOffsetJkgK,
          phase: "two-phase",
          quality: x,
        };
      }
      if (raw < yl) {
        tHi = tK;
        const cp = this.col(i, C_CPL);
        tGuess = tK - (isS ? tK * (1 - Math.exp((raw - yl) / cp)) : (yl - raw) / cp);
      } else {
        tLo = tK;
        const cp = this.col(i, C_CPV);
        tGuess = tK + (isS ? tK * (Math.exp((raw - yv) / cp) - 1) : (raw - yv) / cp);
      }
    } else if (pPa >= this.pSatMaxPa) {
      const g = this.guideGuess(pPa, raw, isS);
      tGuess = g.tK;
      rhoGuess = g.rho;
    } else {
      tGuess = this.tc;
    }
    const tK = this.solveT(pPa, raw, isS, tLo, tHi, tGuess, field, rhoGuess);
    return this.stateAt(pPa, tK, this.lastRho);
  }

  private lastRho = 0;

  /**
   * Temperature on the isobar where h (or s) equals the target: h and s rise monotonically
   * with T at constant P (∂h/∂T = cp, ∂s/∂T = cp/T), so a safeguarded Newton converges.
   */
  private solveT(
    pPa: number,
    target: number,
    isS: boolean,
    lo: number,
    hi: number,
    guess: number,
    field: string,
    rhoGuess?: number,
  ): number {
    const bounds = { lo, hi };
    let loKnown = false,
      hiKnown = false;
    let t = Math.min(hi, Math.max(lo, guess));
    let rho: number | undefined = rhoGuess;
    let tPrev = 0,
      drhodT = 0;
    const evalAt = (tK: number): [number, number] => {
      // seed the density with the isobaric slope (∂ρ/∂T)_P = −(∂p/∂T)_ρ / (∂p/∂ρ)_T
      const seed = rho === undefined || tPrev === 0 ? rho : rho + drhodT * (tK - tPrev);
      rho = this.densityPT(pPa, tK, seed);
      const r = this.raw(rho, tK);
      tPrev = tK;
      drhodT = -r.dpdT / r.dpdrho;
      return isS ? [r.sJkgK - target, r.cpJkgK / tK] : [r.hJkg - target, r.cpJkgK];
    };
    const tol = isS ? 1e-9 : 1e-6;
    for (let it = 0; it < 200; it++) {
      const [f, df] = evalAt(t);
      if (Math.abs(f) <= tol) break;
      if (f > 0) {
        hi = t;
        hiKnown = true;
      } else {
        lo = t;
        loKnown = true;
      }
      let next = t - f / df;
      if (!(next > lo && next < hi)) {
        if (next <= lo && !loKnown) {
          const [fl] = evalAt(lo);
          if (fl > tol) this.flashRange(pPa, field, isS, bounds);
          loKnown = true;
          if (Math.abs(fl) <= tol) {
            t = lo;
            break;
          }
        } else if (next >= hi && !hiKnown) {
          const [fh] = evalAt(hi);
          if (fh < -tol) this.flashRange(pPa, field, isS, bounds);
          hiKnown = true;
          if (Math.abs(fh) <= tol) {
            t = hi;
            break;
          }
        }
        next = 0.5 * (lo + hi);
      }
      if (Math.abs(next - t) < 1e-11 * t) {
        t = next;
        rho = this.densityPT(pPa, t, rho);
        break;
      }
      t = next;
    }
    this.lastRho = rho ?? this.densityPT(pPa, t);
    return t;
  }

  /**
   * Above the saturation table's top pressure there is no dome to start from, and h(T) on
   * a supercritical isobar bends sharply near the pseudo-critical line; a coarse (ln P, T)
   * grid of h, s and ρ, built on first use, gives the flash a start within a few kelvin.
   */
  private guide?: { lnP0: number; dlnP: number; nP: number; nT: number; t: Float64Array; y: Float64Array[]; rho: Float64Array };

  private guideGuess(pPa: number, target: number, isS: boolean): { tK: number; rho: number } {
    if (!this.guide) {
      const nP = 24,
        nT = 64;
      const lnP0 = Math.log(this.pSatMaxPa);
      const dlnP = (Math.log(this.range.pMaxPa) - lnP0) / (nP - 1);
      const t = new Float64Array(nT);
      for (let j = 0; j < nT; j++) t[j] = this.range.tMinK + ((this.range.tMaxK - this.range.tMinK) * j) / (nT - 1);
      const h = new Float64Array(nP * nT),
        sv = new Float64Array(nP * nT),
        rho = new Float64Array(nP * nT);
      for (let i = 0; i < nP; i++) {
        const p = Math.exp(lnP0 + i * dlnP);
        let r: number | undefined;
        for (let j = 0; j < nT; j++) {
          r = this.densityPT(p, t[j], r);
          const props = this.raw(r, t[j]);
          h[i * nT + j] = props.hJkg;
          sv[i * nT + j] = props.sJkgK;
          rho[i * nT + j] = r;
        }
      }
      this.guide = { lnP0, dlnP, nP, nT, t, y: [h, sv], rho };
    }
    const g = this.guide;
    const y = g.y[isS ? 1 : 0];
    const x = (Math.log(pPa) - g.lnP0) / g.dlnP;
    const i0 = Math.min(g.nP - 2, Math.max(0, Math.floor(x)));
    const wP = Math.min(1, Math.max(0, x - i0));
    let tK = 0,
      rho = 0;
    for (const [row, w] of [
      [i0, 1 - wP],
      [i0 + 1, wP],
    ] as const) {
      const base = row * g.nT;
      let a = 0,
        b = g.nT - 1;
      if (target <= y[base]) b = 1;
      else if (target >= y[base + b]) a = b - 1;
      else
        while (b - a > 1) {
          const m = (a + b) >> 1;
          if (y[base + m] > target) b = m;
          else a = m;
        }
      const f = Math.min(1, Math.max(0, (target - y[base + a]) / (y[base + b] - y[base + a])));
      tK += w * (g.t[a] + f * (g.t[b] - g.t[a]));
      rho += w * (g.rho[base + a] + f * (g.rho[base + b] - g.rho[base + a]));
    }
    return { tK, rho };
  }

  private flashRange(pPa: number, field: string, isS: boolean, b: { lo: number; hi: number }): never {
    const at = (tK: number) => {
      const s = this.stateAt(pPa, tK, this.densityPT(pPa, tK));
      return isS ? s.sJkgK : s.hJkg;
    };
    const min = at(this.range.tMinK);
    const max = at(this.range.tMaxK);
    throw new ThermoRangeError(
      `${this.meta.id}: ${field} at ${pPa} Pa outside ${min.toPrecision(6)}…${max.toPrecision(6)} (temperature range ${b.lo}…${b.hi} K)`,
      field,
      { min, max, unit: isS ? "J/(kg·K)" : "J/kg" },
    );
  }
}

/** Builds a Helmholtz-equation fluid (tabulates its saturation curve once). */
export function createHelmholtzFluid(data: PureFluidData): HelmholtzFluid {
  return new HelmholtzFluid(data);
}
