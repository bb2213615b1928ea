import { LIQUID_ROOT, newPhaseEval, PengRobinsonMixture, VAPOUR_ROOT, type PhaseEval } from "./peng-robinson";

/**
 * Vapour–liquid equilibrium of a PR mixture at fixed overall composition z.
 *
 * Equilibrium is equal fugacity of every component in both phases, f_i^L = f_i^V, written with
 * K-values K_i = y_i/x_i = φ_i^L/φ_i^V and the Rachford–Rice material balance
 * Σ z_i (K_i − 1)/(1 + β(K_i − 1)) = 0 (Rachford & Rice, J. Pet. Technol. 4, 1952), solved by
 * successive substitution on the phase compositions with a Newton step on the unknown
 * intensive variable (Michelsen & Mollerup 2007, ch. 10–12). β is the vapour mole fraction:
 * β = 0 is the bubble point, β = 1 the dew point.
 */
export interface TwoPhaseSolution {
  tK: number;
  pPa: number;
  /** Vapour mole fraction. */
  beta: number;
  /** Liquid and vapour mole fractions. */
  x: Float64Array;
  y: Float64Array;
  liquid: PhaseEval;
  vapour: PhaseEval;
}

/** A VLE iteration that did not converge: an internal failure, not a range error. */
export class VleConvergenceError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "VleConvergenceError";
  }
}

const MAX_ITER = 500;

function wilsonK(mix: PengRobinsonMixture, tK: number, pPa: number, i: number): number {
  const c = mix.components[i];
  return (c.pcPa / pPa) * Math.exp(5.373 * (1 + c.omega) * (1 - c.tcK / tK));
}

function rrSum(z: ArrayLike<number>, K: Float64Array, beta: number): number {
  let g = 0;
  for (let i = 0; i < z.length; i++) g += (z[i] * (K[i] - 1)) / (1 + beta * (K[i] - 1));
  return g;
}

/** Initial (T, P) from Wilson's K-value correlation (Wilson, 1968) when no guess is given. */
function wilsonStart(mix: PengRobinsonMixture, z: ArrayLike<number>, spec: "T" | "P", value: number, beta: number, K: Float64Array): { tK: number; pPa: number } {
  const n = mix.n;
  if (spec === "T") {
    // Σ z K = 1 at the bubble point and Σ z/K = 1 at the dew point have closed forms in P.
    let pb = 0;
    let invPd = 0;
    for (let i = 0; i < n; i++) {
      const ps = wilsonK(mix, value, 1, i);
      pb += z[i] * ps;
      invPd += z[i] / ps;
    }
    const pPa = Math.exp((1 - beta) * Math.log(pb) + beta * Math.log(1 / invPd));
    for (let i = 0; i < n; i++) K[i] = wilsonK(mix, value, pPa, i);
    return { tK: value, pPa };
  }
  let tK = 250;
  for (let it = 0; it < 100; it++) {
    let g = 0;
    let dg = 0;
    for (let i = 0; i < n; i++) {
      const c = mix.components[i];
      const k = wilsonK(mix, tK, value, i);
      const d = 1 + beta * (k - 1);
      g += (z[i] * (k - 1)) / d;
      dg += (z[i] * k * 5.373 * (1 + c.omega) * c.tcK) / (tK * tK * d * d);
    }
    const step = g / dg;
    tK -= Math.max(-30, Math.min(30, step));
    if (Math.abs(step) < 1e-8) break;
  }
  for (let i = 0; i < n; i++) K[i] = wilsonK(mix, tK, value, i);
  return { tK, pPa: value };
}

/**
 * Two-phase state at a given vapour mole fraction β and a given T (unknown P) or P (unknown T).
 * β = 0 gives the bubble point, β = 1 the dew point. `guess` (a nearby solution) speeds it up
 * and keeps it on the right branch; without one, Wilson K-values start it.
 */
export function solveFixedBeta(
  mix: PengRobinsonMixture,
  z: ArrayLike<number>,
  spec: "T" | "P",
  value: number,
  beta: number,
  guess?: TwoPhaseSolution,
): TwoPhaseSolution {
  const n = mix.n;
  const K = new Float64Array(n);
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  const lnPhiL = new Float64Array(n);
  let tK: number;
  let pPa: number;
  if (guess) {
    tK = spec === "T" ? value : guess.tK;
    pPa = spec === "P" ? value : guess.pPa;
    for (let i = 0; i < n; i++) K[i] = guess.y[i] / guess.x[i];
  } else {
    ({ tK, pPa } = wilsonStart(mix, z, spec, value, beta, K));
  }
  const liquid = newPhaseEval();
  const vapour = newPhaseEval();
  const setCompositions = () => phaseCompositions(z, K, beta, x, y);
  setCompositions();
  for (let it = 0; it < MAX_ITER; it++) {
    mix.evaluate(tK, pPa, x, LIQUID_ROOT, true, liquid);
    lnPhiL.set(mix.lnPhi);
    mix.evaluate(tK, pPa, y, VAPOUR_ROOT, true, vapour);
    let maxDlnK = 0;
    for (let i = 0; i < n; i++) {
      const kNew = Math.exp(lnPhiL[i] - mix.lnPhi[i]);
      maxDlnK = Math.max(maxDlnK, Math.abs(Math.log(kNew / K[i])));
      K[i] = kNew;
    }
    const g = rrSum(z, K, beta);
    // Quasi-Newton step on the unknown: ln K_i falls as −ln P and rises with T roughly as the
    // component's vapour-pressure slope (Wilson form), which is all the step needs.
    let dg = 0;
    let step: number;
    if (spec === "T") {
      for (let i = 0; i < n; i++) {
        const d = 1 + beta * (K[i] - 1);
        dg -= (z[i] * K[i]) / (d * d);
      }
      step = -g / dg;
      step = Math.max(-0.5, Math.min(0.5, step));
      pPa *= Math.exp(step);
    } else {
      for (let i = 0; i < n; i++) {
        const c = mix.components[i];
        const d = 1 + beta * (K[i] - 1);
        dg += (z[i] * K[i] * 5.373 * (1 + c.omega) * c.tcK) / (tK * tK * d * d);
      }
      step = -g / dg;
      step = Math.max(-20, Math.min(20, step));
      tK += step;
      step /= tK;
    }
    setCompositions();
    if (Math.abs(g) < 1e-13 && Math.abs(step) < 1e-12 && maxDlnK < 1e-12) {
      if (Math.abs(liquid.z - vapour.z) < 1e-4) break;
      mix.evaluate(tK, pPa, x, LIQUID_ROOT, false, liquid);
      mix.evaluate(tK, pPa, y, VAPOUR_ROOT, false, vapour);
      return { tK, pPa, beta, x, y, liquid, vapour };
    }
  }
  throw new VleConvergenceError(`VLE at ${spec} = ${value}, beta = ${beta} did not converge`);
}

/**
 * Isothermal flash at (P, T) inside the two-phase region: Rachford–Rice for β with successive
 * substitution on K. `guess` supplies starting K-values (e.g. from the bubble/dew points).
 */
export function flashPT(mix: PengRobinsonMixture, z: ArrayLike<number>, pPa: number, tK: number, guess: TwoPhaseSolution): TwoPhaseSolution {
  const n = mix.n;
  const K = new Float64Array(n);
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  const lnPhiL = new Float64Array(n);
  for (let i = 0; i < n; i++) K[i] = guess.y[i] / guess.x[i];
  let beta = guess.beta;
  const liquid = newPhaseEval();
  const vapour = newPhaseEval();
  for (let it = 0; it < MAX_ITER; it++) {
    beta = solveRachfordRice(z, K, beta);
    phaseCompositions(z, K, beta, x, y);
    mix.evaluate(tK, pPa, x, LIQUID_ROOT, true, liquid);
    lnPhiL.set(mix.lnPhi);
    mix.evaluate(tK, pPa, y, VAPOUR_ROOT, true, vapour);
    let maxDlnK = 0;
    for (let i = 0; i < n; i++) {
      const kNew = Math.exp(lnPhiL[i] - mix.lnPhi[i]);
      maxDlnK = Math.max(maxDlnK, Math.abs(Math.log(kNew / K[i])));
      K[i] = kNew;
    }
    if (maxDlnK < 1e-13) {
      mix.evaluate(tK, pPa, x, LIQUID_ROOT, false, liquid);
      mix.evaluate(tK, pPa, y, VAPOUR_ROOT, false, vapour);
      return { tK, pPa, beta, x, y, liquid, vapour };
    }
  }
  throw new VleConvergenceError(`PT flash at P = ${pPa} Pa, T = ${tK} K did not converge`);
}

/** β in [0, 1] solving the Rachford–Rice equation for fixed K, by safeguarded Newton. */
export function solveRachfordRice(z: ArrayLike<number>, K: Float64Array, beta0: number): number {
  let lo = 0;
  let hi = 1;
  if (rrSum(z, K, 0) <= 0) return 0;
  if (rrSum(z, K, 1) >= 0) return 1;
  let beta = Math.min(1, Math.max(0, beta0));
  for (let it = 0; it < 100; it++) {
    let g = 0;
    let dg = 0;
    for (let i = 0; i < z.length; i++) {
      const km1 = K[i] - 1;
      const d = 1 + beta * km1;
      g += (z[i] * km1) / d;
      dg -= (z[i] * km1 * km1) / (d * d);
    }
    if (g > 0) lo = beta;
    else hi = beta;
    let next = beta - g / dg;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - beta) < 1e-15) return next;
    beta = next;
  }
  return beta;
}

/** Mass-based mixture properties of a two-phase solution (per kg of overall mixture). */
export function twoPhaseMass(sol: TwoPhaseSolution): { hJkg: number; sJkgK: number; vM3kg: number; quality: number } {
  const b = sol.beta;
  const mL = sol.liquid.molarMassKgMol;
  const mV = sol.vapour.molarMassKgMol;
  const m = (1 - b) * mL + b * mV;
  return {
    hJkg: ((1 - b) * sol.liquid.hJmol + b * sol.vapour.hJmol) / m,
    sJkgK: ((1 - b) * sol.liquid.sJmolK + b * sol.vapour.sJmolK) / m,
    vM3kg: ((1 - b) * sol.liquid.vM3Mol + b * sol.vapour.vM3Mol) / m,
    quality: (b * mV) / m,
  };
}

/**
 * Liquid and vapour compositions of a two-phase split at vapour fraction β with K-factors K
 * (Rachford–Rice material balance x_i = z_i / (1 + β(K_i − 1)), y_i = K_i·x_i), normalised.
 * Writes into x and y.
 */
function phaseCompositions(z: ArrayLike<number>, K: ArrayLike<number>, beta: number, x: number[] | Float64Array, y: number[] | Float64Array): void {
  const n = z.length;
  let sx = 0;
  let sy = 0;
  for (let i = 0; i < n; i++) {
    x[i] = z[i] / (1 + beta * (K[i] - 1));
    y[i] = K[i] * x[i];
    sx += x[i];
    sy += y[i];
  }
  for (let i = 0; i < n; i++) {
    x[i] /= sx;
    y[i] /= sy;
  }
}
