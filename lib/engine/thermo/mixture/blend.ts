import {
  ThermoRangeError,
  type Fluid,
  type FluidMeta,
  type PhaseProps,
  type SaturationState,
  type State,
  type TempConvention,
  type ValidityRange,
} from "../types";
import { BLEND_DEFS, GWP_AR4, type BlendDef, type BlendId } from "./blend-defs";
import type { ComponentId } from "./component";
import { COMPONENTS } from "./components";
import { FixedMixture, LIQUID_ROOT, MixtureModel, newFixedState, VAPOUR_ROOT, type FixedState, type PhaseEval } from "./kunz-wagner";
import { UniformSplines } from "./spline";
import { solveFixedBeta, twoPhaseMass, type TwoPhaseSolution } from "./vle";

/** Lowest temperature any blend state may have (−60 °C). */
const T_MIN_K = 213.15;
/** Highest single-phase temperature (150 °C, above usual discharge temperatures). */
const T_MAX_K = 423.15;
/** Nodes of the saturation table, uniform in ln P. */
const N_P = 121;
/** Vapour-fraction nodes across the two-phase region (Chebyshev–Lobatto, 0 and 1 included). */
const N_BETA = 9;
const BETA_NODES = Array.from({ length: N_BETA }, (_, j) => 0.5 * (1 - Math.cos((Math.PI * j) / (N_BETA - 1))));
// Barycentric weights of Chebyshev–Lobatto nodes: (−1)^j, halved at the ends (Berrut & Trefethen, SIAM Rev. 46, 2004).
const BARY_W = BETA_NODES.map((_, j) => (j % 2 === 0 ? 1 : -1) * (j === 0 || j === N_BETA - 1 ? 0.5 : 1));

// Series layout in the spline set: per β node j, T, h, s, v, q; then cp of both boundaries, w of the dew-point vapour and of the bubble-point liquid.
const S_T = 0;
const S_H = 1;
const S_S = 2;
const S_V = 3;
const S_Q = 4;
const PER_BETA = 5;
const S_CPL = N_BETA * PER_BETA;
const S_CPV = S_CPL + 1;
const S_WV = S_CPL + 2;
const S_WL = S_CPL + 3;
const idx = (j: number, q: number) => j * PER_BETA + q;

/** Mass-based single-phase properties of the blend at its overall composition. */
interface MassProps {
  hJkg: number;
  sJkgK: number;
  densityKgM3: number;
  cpJkgK: number;
  speedOfSoundMs: number;
}

/**
 * One refrigerant blend on the multi-fluid Helmholtz mixture model (see README.md of the thermo module).
 *
 * Saturation, two-phase states and the phase boundaries come from a table built once, when the
 * blend is created: at 121 pressures (uniform in ln P, from the dew pressure at −60 °C to
 * `range.pMaxPa`) and 9 vapour mole fractions β from the bubble point (β = 0) to the dew point
 * (β = 1), each a full fugacity-based VLE solution; natural cubic splines in ln P and barycentric
 * interpolation in β read it. Single-phase states are evaluated directly from the equation of
 * state. `exact*` methods run the full VLE solve instead, for checks.
 *
 * Saturation states are at one pressure: `pBubblePa === pDewPa`, the liquid is the bubble-point
 * liquid and the vapour the dew-point vapour at that pressure, and `glideK = tDew − tBubble`.
 */
export class HelmholtzBlend implements Fluid {
  readonly meta: FluidMeta;
  readonly range: ValidityRange;
  /** Lowest pressure served, Pa (dew pressure at −60 °C, less 2 %). */
  readonly pMinPa: number;
  readonly mix: MixtureModel;
  readonly z: Float64Array;
  private readonly molarMass: number;
  private hOffset = 0;
  private sOffset = 0;
  private readonly table: UniformSplines;
  /** The mixture at the overall composition, compiled for single-phase states. */
  readonly fixedMix: FixedMixture;
  private readonly fs: FixedState = newFixedState();
  /** Last single-phase density per branch (mol/m³), seeding the next solve. */
  private lastRho = [0, 0];
  /** Whether the last `solveSingle` converged on its fast path (then `fs` is that state). */
  private fastOk = false;
  // Scratch for the β-direction values at the located pressure.
  private readonly bh = new Float64Array(N_BETA);
  private readonly bs = new Float64Array(N_BETA);
  private readonly bt = new Float64Array(N_BETA);
  private readonly bv = new Float64Array(N_BETA);
  private readonly bq = new Float64Array(N_BETA);

  constructor(def: BlendDef) {
    const { mix, z } = buildMixture(def);
    this.mix = mix;
    this.z = z;
    this.molarMass = mix.molarMass(z);
    this.fixedMix = mix.fixed(z);

    // IIR reference: h = 200 kJ/kg, s = 1 kJ/(kg·K) for the bubble-point liquid at 0 °C.
    const ref = solveFixedBeta(mix, z, "T", 273.15, 0);
    this.hOffset = 200e3 - ref.liquid.hJmol / this.molarMass;
    this.sOffset = 1e3 - ref.liquid.sJmolK / this.molarMass;

    const dewMin = solveFixedBeta(mix, z, "T", T_MIN_K, 1);
    this.pMinPa = dewMin.pPa * 0.98;
    this.range = { tMinK: T_MIN_K, tMaxK: T_MAX_K, pMaxPa: def.pMaxPa };
    this.meta = blendMetaOf(def);
    this.table = this.buildTable();
  }

  private buildTable(): UniformSplines {
    const u0 = Math.log(this.pMinPa);
    const du = (Math.log(this.range.pMaxPa) - u0) / (N_P - 1);
    const series = Array.from({ length: S_WL + 1 }, () => new Float64Array(N_P));
    let prev: TwoPhaseSolution[] = [];
    let prev2: TwoPhaseSolution[] = [];
    let prev3: TwoPhaseSolution[] = [];
    let prev4: TwoPhaseSolution[] = [];
    for (let i = 0; i < N_P; i++) {
      const p = Math.exp(u0 + i * du);
      const sols: TwoPhaseSolution[] = [];
      for (let j = 0; j < N_BETA; j++) {
        // extrapolated from the previous pressures (ln K, T, densities; cubic once four exist)
        const guess = prev[j] && prev2[j] ? extrapolate(prev[j], prev2[j], prev3[j], prev4[j]) : (prev[j] ?? sols[j - 1]);
        const sol = solveFixedBeta(this.mix, this.z, "P", p, BETA_NODES[j], guess);
        sols.push(sol);
        const m = twoPhaseMass(sol);
        series[idx(j, S_T)][i] = sol.tK;
        series[idx(j, S_H)][i] = m.hJkg + this.hOffset;
        series[idx(j, S_S)][i] = m.sJkgK + this.sOffset;
        series[idx(j, S_V)][i] = m.vM3kg;
        series[idx(j, S_Q)][i] = j === 0 ? 0 : j === N_BETA - 1 ? 1 : m.quality;
      }
      const liq = this.phaseMass(sols[0].liquid);
      const vap = this.phaseMass(sols[N_BETA - 1].vapour);
      series[S_CPL][i] = liq.cpJkgK;
      series[S_CPV][i] = vap.cpJkgK;
      series[S_WV][i] = vap.speedOfSoundMs;
      series[S_WL][i] = liq.speedOfSoundMs;
      prev4 = prev3;
      prev3 = prev2;
      prev2 = prev;
      prev = sols;
    }
    return new UniformSplines(u0, du, series);
  }

  /** Mass-based properties of one evaluated phase (composition = that phase's own). */
  private phaseMass(e: PhaseEval): MassProps {
    const m = e.molarMassKgMol;
    return {
      hJkg: e.hJmol / m + this.hOffset,
      sJkgK: e.sJmolK / m + this.sOffset,
      densityKgM3: m / e.vM3Mol,
      cpJkgK: e.cpJmolK / m,
      speedOfSoundMs: e.speedOfSoundMs,
    };
  }

  private singlePhase(tK: number, pPa: number, root: 0 | 1): MassProps {
    const f = this.fixedMix;
    const rho = f.density(tK, pPa, root, this.lastRho[root]);
    this.lastRho[root] = rho;
    return this.fixedMass(f.at(rho, tK, this.fs));
  }

  /** Mass-based properties of a state of the overall composition. */
  private fixedMass(st: FixedState): MassProps {
    const m = this.molarMass;
    return {
      hJkg: st.h / m + this.hOffset,
      sJkgK: st.s / m + this.sOffset,
      densityKgM3: st.rho * m,
      cpJkgK: st.cp / m,
      speedOfSoundMs: st.w,
    };
  }

  private checkP(pPa: number): void {
    if (!(pPa >= this.pMinPa && pPa <= this.range.pMaxPa)) {
      throw new ThermoRangeError(
        `${this.meta?.id ?? "blend"}: pPa = ${pPa} is outside ${this.pMinPa.toFixed(0)}…${this.range.pMaxPa} Pa`,
        "pPa",
        { min: this.pMinPa, max: this.range.pMaxPa, unit: "Pa" },
      );
    }
  }

  /** Fills the β-direction scratch arrays at ln P already located in the table. */
  private loadBeta(): void {
    const t = this.table;
    for (let j = 0; j < N_BETA; j++) {
      this.bt[j] = t.value(idx(j, S_T));
      this.bh[j] = t.value(idx(j, S_H));
      this.bs[j] = t.value(idx(j, S_S));
      this.bv[j] = t.value(idx(j, S_V));
      this.bq[j] = t.value(idx(j, S_Q));
    }
  }

  private saturationAtLocated(pPa: number): SaturationState {
    const t = this.table;
    const tb = t.value(idx(0, S_T));
    const td = t.value(idx(N_BETA - 1, S_T));
    const liquid: PhaseProps = {
      tK: tb,
      pPa,
      densityKgM3: 1 / t.value(idx(0, S_V)),
      hJkg: t.value(idx(0, S_H)),
      sJkgK: t.value(idx(0, S_S)),
      cpJkgK: t.value(S_CPL),
      speedOfSoundMs: t.value(S_WL),
    };
    const vapour: PhaseProps = {
      tK: td,
      pPa,
      densityKgM3: 1 / t.value(idx(N_BETA - 1, S_V)),
      hJkg: t.value(idx(N_BETA - 1, S_H)),
      sJkgK: t.value(idx(N_BETA - 1, S_S)),
      cpJkgK: t.value(S_CPV),
      speedOfSoundMs: t.value(S_WV),
    };
    return { tBubbleK: tb, tDewK: td, pBubblePa: pPa, pDewPa: pPa, liquid, vapour, glideK: td - tb };
  }

  /**
   * Saturation at a temperature: the pressure at which the dew (default), bubble or mean
   * ((bubble + dew)/2) temperature equals tK, read from the saturation table (cubic spline in
   * ln P, inverted by Newton's method). With the dew convention `tDewK === tK` exactly, with
   * bubble `tBubbleK === tK`.
   */
  saturationAtT(tK: number, convention: TempConvention = "dew"): SaturationState {
    const t = this.table;
    const kb = idx(0, S_T);
    const kd = idx(N_BETA - 1, S_T);
    const nb = t.nodes(kb);
    const nd = t.nodes(kd);
    const at = (i: number) => (convention === "dew" ? nd[i] : convention === "bubble" ? nb[i] : 0.5 * (nb[i] + nd[i]));
    const lo = at(0);
    const hi = at(t.n - 1);
    const tLo = Math.max(T_MIN_K, lo);
    if (!(tK >= tLo && tK <= hi)) {
      throw new ThermoRangeError(
        `${this.meta.id}: saturation ${convention} temperature tK = ${tK} is outside ${tLo.toFixed(2)}…${hi.toFixed(2)} K`,
        "tK",
        { min: tLo, max: hi, unit: "K" },
      );
    }
    // Bisection on the (monotone) node values, then Newton inside the cell.
    let a = 0;
    let b = t.n - 1;
    while (b - a > 1) {
      const m = (a + b) >> 1;
      if (at(m) <= tK) a = m;
      else b = m;
    }
    const ta = at(a);
    const tb = at(b);
    let u = t.x0 + (a + (tK - ta) / (tb - ta)) * t.dx;
    for (let it = 0; it < 8; it++) {
      t.locate(u);
      const f =
        convention === "dew" ? t.value(kd) : convention === "bubble" ? t.value(kb) : 0.5 * (t.value(kb) + t.value(kd));
      const df =
        convention === "dew" ? t.slope(kd) : convention === "bubble" ? t.slope(kb) : 0.5 * (t.slope(kb) + t.slope(kd));
      const step = (f - tK) / df;
      u -= step;
      if (Math.abs(step) < 1e-13) break;
    }
    t.locate(u);
    const sat = this.saturationAtLocated(Math.exp(u));
    if (convention === "dew") sat.tDewK = sat.vapour.tK = tK;
    else if (convention === "bubble") sat.tBubbleK = sat.liquid.tK = tK;
    sat.glideK = sat.tDewK - sat.tBubbleK;
    return sat;
  }

  /** Saturation at a pressure: bubble and dew temperatures and the saturated phases, from the table. */
  saturationAtP(pPa: number): SaturationState {
    this.checkP(pPa);
    this.table.locate(Math.log(pPa));
    return this.saturationAtLocated(pPa);
  }

  private barycentric(f: Float64Array, beta: number): number {
    let num = 0;
    let den = 0;
    for (let j = 0; j < N_BETA; j++) {
      const d = beta - BETA_NODES[j];
      if (d === 0) return f[j];
      const c = BARY_W[j] / d;
      num += c * f[j];
      den += c;
    }
    return num / den;
  }

  /** β ∈ [0, 1] where the interpolated series f equals target (f monotone in β), by the Illinois method. */
  private solveBeta(f: Float64Array, target: number): number {
    let b0 = 0;
    let f0 = f[0] - target;
    let b1 = 1;
    let f1 = f[N_BETA - 1] - target;
    if (f0 === 0) return 0;
    if (f1 === 0) return 1;
    let side = 0;
    let b = f0 / (f0 - f1);
    const tol = 1e-12 * (Math.abs(target) + 1);
    for (let it = 0; it < 100; it++) {
      b = b0 - (f0 * (b1 - b0)) / (f1 - f0);
      const fb = this.barycentric(f, b) - target;
      if (Math.abs(fb) <= tol || b1 - b0 < 1e-15) break;
      // Regula falsi with the Illinois modification (Dowell & Jarratt, BIT 11, 1971): halving the
      // retained end's value keeps convergence superlinear on curved h(β).
      if (fb * f0 < 0) {
        b1 = b;
        f1 = fb;
        if (side === -1) f0 /= 2;
        side = -1;
      } else {
        b0 = b;
        f0 = fb;
        if (side === 1) f1 /= 2;
        side = 1;
      }
    }
    return b;
  }

  private twoPhaseState(pPa: number, beta: number): State {
    const v = this.barycentric(this.bv, beta);
    return {
      phase: "two-phase",
      tK: this.barycentric(this.bt, beta),
      pPa,
      densityKgM3: 1 / v,
      hJkg: this.barycentric(this.bh, beta),
      sJkgK: this.barycentric(this.bs, beta),
      quality: Math.min(1, Math.max(0, this.barycentric(this.bq, beta))),
    };
  }

  private single(pPa: number, tK: number, root: 0 | 1): State {
    const m = this.singlePhase(tK, pPa, root);
    return { phase: root === LIQUID_ROOT ? "liquid" : "vapour", tK, pPa, ...m };
  }

  private checkT(tK: number): void {
    if (!(tK >= T_MIN_K && tK <= T_MAX_K)) {
      throw new ThermoRangeError(`${this.meta.id}: tK = ${tK} is outside ${T_MIN_K}…${T_MAX_K} K`, "tK", {
        min: T_MIN_K,
        max: T_MAX_K,
        unit: "K",
      });
    }
  }

  /** State at (P, T): compressed liquid below the bubble point, superheated vapour above the dew point, two-phase between. */
  statePT(pPa: number, tK: number): State {
    this.checkP(pPa);
    this.checkT(tK);
    this.table.locate(Math.log(pPa));
    const tb = this.table.value(idx(0, S_T));
    const td = this.table.value(idx(N_BETA - 1, S_T));
    if (tK < tb) return this.single(pPa, tK, LIQUID_ROOT);
    if (tK > td) return this.single(pPa, tK, VAPOUR_ROOT);
    this.loadBeta();
    const beta = td > tb ? this.solveBeta(this.bt, tK) : 0.5;
    const s = this.twoPhaseState(pPa, beta);
    s.tK = tK;
    return s;
  }

  /**
   * State at (P, h). Inside the dome: isenthalpic two-phase flash at the blend's overall
   * composition, read from the β-table. Outside: Newton's method on T with dh/dT = cp.
   */
  statePH(pPa: number, hJkg: number): State {
    return this.flashPX(pPa, hJkg, "h");
  }

  /** State at (P, s): as `statePH`, with ds/dT = cp/T. */
  statePS(pPa: number, sJkgK: number): State {
    return this.flashPX(pPa, sJkgK, "s");
  }

  private flashPX(pPa: number, target: number, kind: "h" | "s"): State {
    this.checkP(pPa);
    const field = kind === "h" ? "hJkg" : "sJkgK";
    if (!Number.isFinite(target)) {
      throw new ThermoRangeError(`${this.meta.id}: ${field} = ${target} is not a finite number`, field, { unit: kind === "h" ? "J/kg" : "J/(kg·K)" });
    }
    this.table.locate(Math.log(pPa));
    const kx = kind === "h" ? S_H : S_S;
    const xb = this.table.value(idx(0, kx));
    const xd = this.table.value(idx(N_BETA - 1, kx));
    if (target >= xb && target <= xd) {
      this.loadBeta();
      const beta = this.solveBeta(kind === "h" ? this.bh : this.bs, target);
      const s = this.twoPhaseState(pPa, beta);
      if (kind === "h") s.hJkg = target;
      else s.sJkgK = target;
      return s;
    }
    const liquid = target < xb;
    const root = liquid ? LIQUID_ROOT : VAPOUR_ROOT;
    const tK = this.solveSingle(pPa, target, kind, root, xb, xd, field);
    // on the fast path `this.fs` holds the converged state at exactly this temperature
    if (this.fs.tK === tK && this.fastOk) {
      return { phase: liquid ? "liquid" : "vapour", tK, pPa, ...this.fixedMass(this.fs) };
    }
    return this.single(pPa, tK, root);
  }

  /**
   * Temperature of the single-phase state at (P, h) or (P, s): Newton's method on the pair
   * p(ρ, T) = P, y(ρ, T) = target in (ρ, T) together, one evaluation of the equation per step
   * (Span 2000, Table 3.3 derivatives), started one cp-step from the saturated phase of the
   * table; a step that leaves the phase's branch ((∂p/∂ρ)_T ≤ 0) or the range is halved.
   */
  private solveSingle(pPa: number, target: number, kind: "h" | "s", root: 0 | 1, xb: number, xd: number, field: string): number {
    const liquid = root === LIQUID_ROOT;
    const f = this.fixedMix;
    const m = this.molarMass;
    const t = this.table;
    const tSat = liquid ? t.value(idx(0, S_T)) : t.value(idx(N_BETA - 1, S_T));
    const cpSat = liquid ? t.value(S_CPL) : t.value(S_CPV);
    const rhoSat = (liquid ? 1 / t.value(idx(0, S_V)) : 1 / t.value(idx(N_BETA - 1, S_V))) / m;
    const dxSat = target - (liquid ? xb : xd);
    let tK = kind === "h" ? tSat + dxSat / cpSat : tSat * Math.exp(dxSat / cpSat);
    tK = Math.min(T_MAX_K + 60, Math.max(T_MIN_K - 30, tK));
    // molar target in the equation's own reference
    const yTarget = ((kind === "h" ? target - this.hOffset : target - this.sOffset) * m);
    // density start: the saturated phase's, scaled as an ideal gas for vapour (same pressure)
    let rho = liquid ? rhoSat : (rhoSat * tSat) / tK;
    const st = this.fs;
    let ok = false;
    for (let it = 0; it < 60; it++) {
      f.at(rho, tK, st);
      const F1 = st.p - pPa;
      const y = kind === "h" ? st.h : st.s;
      const F2 = y - yTarget;
      const yr = kind === "h" ? st.dhdrho : st.dsdrho;
      const yt = kind === "h" ? st.dhdT : st.dsdT;
      const det = st.dpdrho * yt - st.dpdT * yr;
      let dRho = -(F1 * yt - F2 * st.dpdT) / det;
      let dT = -(st.dpdrho * F2 - yr * F1) / det;
      if (!Number.isFinite(dRho) || !Number.isFinite(dT) || !(st.dpdrho > 0)) break;
      // keep the step modest: 30 % in density, 40 K in temperature
      let g = 1;
      if (Math.abs(dRho) > 0.3 * rho) g = Math.min(g, (0.3 * rho) / Math.abs(dRho));
      if (Math.abs(dT) > 40) g = Math.min(g, 40 / Math.abs(dT));
      dRho *= g;
      dT *= g;
      rho += dRho;
      tK += dT;
      if (Math.abs(dT) < 1e-9 * tK && Math.abs(dRho) < 1e-11 * rho && Math.abs(F1) < 1e-7 * pPa) {
        ok = true;
        break;
      }
    }
    if (ok) {
      // confirm the branch: a converged (ρ, T) must be mechanically stable and on the asked side
      f.at(rho, tK, st);
      const tb = t.value(idx(0, S_T));
      const td = t.value(idx(N_BETA - 1, S_T));
      // …and on its own branch: a liquid denser than (about) the bubble-point liquid, a vapour
      // lighter than the dew-point vapour (a metastable root on the other branch fails this)
      const branchOk = liquid ? rho > 0.9 * rhoSat : rho < 1.1 * rhoSat;
      if (!(st.dpdrho > 0) || !branchOk || (liquid ? tK > tb + 1e-6 : tK < td - 1e-6)) ok = false;
    }
    this.fastOk = ok;
    if (!ok) tK = this.solveSingleNested(pPa, target, kind, root, tSat, cpSat, dxSat);
    else this.lastRho[root] = rho;
    // A state exactly at a limit may converge a rounding error beyond it.
    if (tK > T_MIN_K - 1e-7 && tK < T_MIN_K) tK = T_MIN_K;
    if (tK < T_MAX_K + 1e-7 && tK > T_MAX_K) tK = T_MAX_K;
    if (tK < T_MIN_K || tK > T_MAX_K) {
      const tLimit = liquid ? T_MIN_K : T_MAX_K;
      const lim = this.singlePhase(tLimit, pPa, root);
      const xLimit = kind === "h" ? lim.hJkg : lim.sJkgK;
      const unit = kind === "h" ? "J/kg" : "J/(kg·K)";
      throw new ThermoRangeError(
        `${this.meta.id}: ${field} = ${target} at pPa = ${pPa} is outside ${liquid ? xLimit.toFixed(1) : xb.toFixed(1)}…${liquid ? xd.toFixed(1) : xLimit.toFixed(1)} ${unit} (T ${T_MIN_K}…${T_MAX_K} K)`,
        field,
        liquid ? { min: xLimit, unit } : { max: xLimit, unit },
      );
    }
    return tK;
  }

  /** Fallback: Newton in T along the isobar, a density solve per step (dh/dT = cp, ds/dT = cp/T). */
  private solveSingleNested(pPa: number, target: number, kind: "h" | "s", root: 0 | 1, tSat: number, cpSat: number, dxSat: number): number {
    let tK = kind === "h" ? tSat + dxSat / cpSat : tSat * Math.exp(dxSat / cpSat);
    for (let it = 0; it < 50; it++) {
      tK = Math.min(T_MAX_K + 60, Math.max(T_MIN_K - 30, tK));
      const mp = this.singlePhase(tK, pPa, root);
      const x = kind === "h" ? mp.hJkg : mp.sJkgK;
      const dx = kind === "h" ? mp.cpJkgK : mp.cpJkgK / tK;
      let step = (x - target) / dx;
      step = Math.max(-40, Math.min(40, step));
      tK -= step;
      if (Math.abs(step) < 1e-9) break;
    }
    return tK;
  }

  /** Full VLE solve (no table) of the two-phase state at P and vapour mole fraction β, mass based. */
  exactTwoPhase(pPa: number, beta: number): { tK: number; hJkg: number; sJkgK: number; densityKgM3: number; quality: number } {
    const sol = solveFixedBeta(this.mix, this.z, "P", pPa, beta);
    const m = twoPhaseMass(sol);
    return { tK: sol.tK, hJkg: m.hJkg + this.hOffset, sJkgK: m.sJkgK + this.sOffset, densityKgM3: 1 / m.vM3kg, quality: m.quality };
  }

  /** Full VLE solve (no table) of the bubble (β = 0) or dew (β = 1) point at temperature tK. */
  exactSaturationAtT(tK: number, beta: 0 | 1): { pPa: number; densityKgM3: number; hJkg: number; sJkgK: number } {
    const sol = solveFixedBeta(this.mix, this.z, "T", tK, beta);
    const m = beta === 0 ? this.phaseMass(sol.liquid) : this.phaseMass(sol.vapour);
    return { pPa: sol.pPa, densityKgM3: m.densityKgM3, hJkg: m.hJkg, sJkgK: m.sJkgK };
  }
}

/** A starting guess two grid steps on: 2·a − b in T, ln K and the densities. */
function extrapolate(a: TwoPhaseSolution, b: TwoPhaseSolution, c?: TwoPhaseSolution, d?: TwoPhaseSolution): TwoPhaseSolution {
  const n = a.x.length;
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  // the grid is uniform in ln P: linear from two previous rows (2a − b), quadratic from three
  // (3a − 3b + c), cubic from four (4a − 6b + 4c − d)
  const ex = (va: number, vb: number, vc: number | undefined, vd: number | undefined) =>
    vc === undefined ? 2 * va - vb : vd === undefined ? 3 * va - 3 * vb + vc : 4 * va - 6 * vb + 4 * vc - vd;
  const lnK = (s: TwoPhaseSolution | undefined, i: number) => (s ? Math.log(s.y[i] / s.x[i]) : undefined);
  for (let i = 0; i < n; i++) {
    x[i] = a.x[i];
    // K = y/x extrapolated in ln K
    y[i] = a.x[i] * Math.exp(ex(lnK(a, i)!, lnK(b, i)!, lnK(c, i), lnK(d, i)));
  }
  const rho = (ra: number, rb: number, rc: number | undefined, rd: number | undefined) => {
    const r = ex(ra, rb, rc, rd);
    return r > 0 ? r : ra;
  };
  return {
    tK: ex(a.tK, b.tK, c?.tK, d?.tK),
    pPa: a.pPa,
    beta: a.beta,
    x,
    y,
    liquid: { ...a.liquid, rhoMolM3: rho(a.liquid.rhoMolM3, b.liquid.rhoMolM3, c?.liquid.rhoMolM3, d?.liquid.rhoMolM3) },
    vapour: { ...a.vapour, rhoMolM3: rho(a.vapour.rhoMolM3, b.vapour.rhoMolM3, c?.vapour.rhoMolM3, d?.vapour.rhoMolM3) },
    jacobian: a.jacobian,
  };
}

const mixtureCache = new Map<string, MixtureModel>();

function buildMixture(def: BlendDef): { mix: MixtureModel; z: Float64Array; ids: ComponentId[]; w: number[] } {
  const ids = Object.keys(def.massFractions) as ComponentId[];
  const comps = ids.map((i) => COMPONENTS[i]);
  const w = ids.map((i) => def.massFractions[i] ?? 0);
  const moles = w.map((wi, k) => wi / comps[k].eos.molarMassKgMol);
  const total = moles.reduce((a, b) => a + b, 0);
  const z = Float64Array.from(moles, (m) => m / total);
  const key = ids.join("/");
  let mix = mixtureCache.get(key);
  if (!mix) {
    mix = new MixtureModel(comps);
    mixtureCache.set(key, mix);
  }
  return { mix, z, ids, w };
}

const metaCache = new Map<BlendId, FluidMeta>();

/**
 * Metadata of a blend without building its tables: molar mass from the composition, normal
 * boiling point (bubble point at 101.325 kPa) from one VLE solve of the model, GWP as the
 * mass-weighted AR4 values of the components.
 */
export function blendMetaOf(def: BlendDef): FluidMeta {
  const id = def.id as BlendId;
  const hit = metaCache.get(id);
  if (hit) return hit;
  const { mix, z, ids, w } = buildMixture(def);
  const gwp = ids.reduce((s, c, k) => s + w[k] * GWP_AR4[c], 0);
  const meta: FluidMeta = {
    id: def.id,
    name: def.name,
    molarMassKgMol: mix.molarMass(z),
    criticalTempK: def.criticalTempK,
    criticalPressurePa: def.criticalPressurePa,
    criticalDensityKgM3: def.criticalDensityKgM3,
    normalBoilingPointK: solveFixedBeta(mix, z, "P", 101325, 0).tK,
    safetyGroup: def.safetyGroup,
    gwp100: Math.round(gwp),
    gwpSource: "IPCC AR4 (100-year), mass-weighted as in Regulation (EU) No 517/2014 Annex IV",
    odp: 0,
    composition: Object.fromEntries(ids.map((c, k) => [c, w[k]])),
    zeotropic: def.zeotropic,
    model: "Multi-fluid Helmholtz mixture model (Kunz–Wagner form; reference equations of the components, published binary parameters)",
  };
  metaCache.set(id, meta);
  return meta;
}

const cache = new Map<BlendId, HelmholtzBlend>();

/** The blend model for an id, built (and its tables computed) on first use, then cached. */
export function getBlend(id: BlendId): HelmholtzBlend {
  let b = cache.get(id);
  if (!b) {
    b = new HelmholtzBlend(BLEND_DEFS[id]);
    cache.set(id, b);
  }
  return b;
}
