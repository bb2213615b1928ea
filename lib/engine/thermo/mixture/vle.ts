import { LIQUID_ROOT, newPhaseEval, MixtureModel, VAPOUR_ROOT, type PhaseEval } from "./kunz-wagner";

/**
 * Vapour–liquid equilibrium of the multi-fluid mixture model at fixed overall composition z.
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
  /**
   * The last Newton Jacobian of the solve (row-major, (n + 1)², in u = ln K, ln T or ln P): a
   * neighbouring solve that takes this solution as its guess starts from it instead of
   * differencing a new one.
   */
  jacobian?: Float64Array;
}

/** A VLE iteration that did not converge: an internal failure, not a range error. */
export class VleConvergenceError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "VleConvergenceError";
  }
}

const MAX_ITER = 500;

function wilsonK(mix: MixtureModel, tK: number, pPa: number, i: number): number {
  const c = mix.components[i];
  return (c.pcPa / pPa) * Math.exp(5.373 * (1 + c.omega) * (1 - c.tcK / tK));
}

function rrSum(z: ArrayLike<number>, K: Float64Array, beta: number): number {
  let g = 0;
  for (let i = 0; i < z.length; i++) g += (z[i] * (K[i] - 1)) / (1 + beta * (K[i] - 1));
  return g;
}

/** Initial (T, P) from Wilson's K-value correlation (Wilson, 1968) when no guess is given. */
function wilsonStart(mix: MixtureModel, z: ArrayLike<number>, spec: "T" | "P", value: number, beta: number, K: Float64Array): { tK: number; pPa: number } {
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
 * and keeps it on the right branch; without one, Wilson K-values start it and a few
 * successive-substitution steps bring it near the solution.
 *
 * The solve is Newton's method on u = (ln K_1 … ln K_n, ln T or ln P) for the equations
 * ln K_i + ln φ_i^V(y) − ln φ_i^L(x) = 0 (equal fugacities) and the Rachford–Rice balance
 * Σ z_i (K_i − 1)/(1 + β(K_i − 1)) = 0, with x_i = z_i/(1 + β(K_i − 1)), y_i = K_i x_i. The
 * Jacobian is taken by forward differences of the analytic ln φ (n + 1 extra phase pairs) only
 * when the guess carries none or the residual stops falling fast; otherwise the guess's
 * Jacobian, kept current by Broyden updates, is used. From a neighbouring solution it
 * converges in three or four residual evaluations.
 */
export function solveFixedBeta(
  mix: MixtureModel,
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
  if (guess) {
    // the neighbouring solution's densities seed the density solves
    liquid.rhoMolM3 = guess.liquid.rhoMolM3;
    liquid.root = LIQUID_ROOT;
    vapour.rhoMolM3 = guess.vapour.rhoMolM3;
    vapour.root = VAPOUR_ROOT;
  } else {
    // successive substitution with a quasi-Newton step on the unknown, to a loose tolerance
    for (let it = 0; it < 60; it++) {
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
      const g = rrSum(z, K, beta);
      let dg = 0;
      if (spec === "T") {
        for (let i = 0; i < n; i++) {
          const d = 1 + beta * (K[i] - 1);
          dg -= (z[i] * K[i]) / (d * d);
        }
        pPa *= Math.exp(Math.max(-0.5, Math.min(0.5, -g / dg)));
      } else {
        for (let i = 0; i < n; i++) {
          const c = mix.components[i];
          const d = 1 + beta * (K[i] - 1);
          dg += (z[i] * K[i] * 5.373 * (1 + c.omega) * c.tcK) / (tK * tK * d * d);
        }
        tK += Math.max(-20, Math.min(20, -g / dg));
      }
      if (Math.abs(g) < 1e-5 && maxDlnK < 1e-5) break;
    }
  }
  const m = n + 1;
  const u = new Float64Array(m);
  for (let i = 0; i < n; i++) u[i] = Math.log(K[i]);
  u[n] = Math.log(spec === "P" ? tK : pPa);
  const F = new Float64Array(m);
  const F2 = new Float64Array(m);
  const J = new Float64Array(m * m);
  const du = new Float64Array(m);
  const residual = (v: Float64Array, out: Float64Array): void => {
    for (let i = 0; i < n; i++) K[i] = Math.exp(v[i]);
    if (spec === "P") tK = Math.exp(v[n]);
    else pPa = Math.exp(v[n]);
    out[n] = rrSum(z, K, beta);
    phaseCompositions(z, K, beta, x, y);
    mix.evaluate(tK, pPa, x, LIQUID_ROOT, true, liquid);
    lnPhiL.set(mix.lnPhi);
    mix.evaluate(tK, pPa, y, VAPOUR_ROOT, true, vapour);
    for (let i = 0; i < n; i++) out[i] = v[i] + mix.lnPhi[i] - lnPhiL[i];
  };
  const h = 1e-7;
  // The Jacobian is differenced afresh only when the residual stops falling fast; between
  // refreshes Broyden updates keep it (a neighbouring solve's Jacobian starts it when given):
  // from a neighbouring solution no new differencing is usually needed.
  const LU = new Float64Array(m * m);
  let fPrev = Infinity;
  let fresh = false;
  const step = new Float64Array(m);
  const FOld = new Float64Array(m);
  let haveStep = false;
  if (guess?.jacobian && guess.jacobian.length === m * m) {
    // a neighbouring solve's Jacobian: kept while the residual falls fast, else refreshed
    J.set(guess.jacobian);
    fresh = true;
  }
  for (let it = 0; it < 60; it++) {
    residual(u, F);
    let fMax = 0;
    for (let i = 0; i < m; i++) fMax = Math.max(fMax, Math.abs(F[i]));
    if (!Number.isFinite(fMax)) break;
    // converged: every ln-fugacity difference within 1e-10 and the material balance (Rachford–Rice
    // sum) within 1e-14; the phases were just evaluated at this point with all their properties
    if (fMax < 1e-10 && Math.abs(F[n]) < 1e-14) {
      if (Math.abs(liquid.z - vapour.z) < 1e-5) break;
      return { tK, pPa, beta, x, y, liquid, vapour, jacobian: J };
    }
    if (fresh && haveStep && fMax <= 0.2 * fPrev) {
      // Broyden's rank-one update of the kept Jacobian with the last step s and the change of
      // the residual y: J += (y − J·s)·sᵀ/(sᵀs) (Broyden, Math. Comp. 19, 1965)
      let ss = 0;
      for (let k = 0; k < m; k++) ss += step[k] * step[k];
      if (ss > 0) {
        for (let i = 0; i < m; i++) {
          let js = 0;
          for (let k = 0; k < m; k++) js += J[i * m + k] * step[k];
          const r = (F[i] - FOld[i] - js) / ss;
          for (let k = 0; k < m; k++) J[i * m + k] += r * step[k];
        }
      }
    }
    if (!fresh || fMax > 0.2 * fPrev) {
      for (let k = 0; k < m; k++) {
        const save = u[k];
        u[k] = save + h;
        residual(u, F2);
        u[k] = save;
        for (let i = 0; i < m; i++) J[i * m + k] = (F2[i] - F[i]) / h;
      }
      fresh = true;
    }
    fPrev = fMax;
    LU.set(J);
    for (let i = 0; i < m; i++) du[i] = -F[i];
    if (!solveLinear(LU, du, m)) break;
    // limit the step: ln K by 0.5, the unknown by 10 %
    let scale = 1;
    for (let i = 0; i < n; i++) scale = Math.min(scale, 0.5 / Math.max(Math.abs(du[i]), 1e-300));
    scale = Math.min(scale, 0.1 / Math.max(Math.abs(du[n]), 1e-300));
    let stepMax = 0;
    FOld.set(F);
    haveStep = true;
    for (let i = 0; i < m; i++) {
      step[i] = scale * du[i];
      u[i] += scale * du[i];
      stepMax = Math.max(stepMax, Math.abs(scale * du[i]));
    }
    if (stepMax < 1e-11 && fMax < 1e-9) {
      // the last evaluation (both phases, all properties) at the converged point
      residual(u, F);
      if (Math.abs(liquid.z - vapour.z) < 1e-5) break;
      return { tK, pPa, beta, x, y, liquid, vapour, jacobian: J };
    }
  }
  throw new VleConvergenceError(`VLE at ${spec} = ${value}, beta = ${beta} did not converge`);
}

/** Solves A·x = b in place (b becomes x) by Gaussian elimination with partial pivoting. */
function solveLinear(A: Float64Array, b: Float64Array, m: number): boolean {
  for (let c = 0; c < m; c++) {
    let piv = c;
    for (let r = c + 1; r < m; r++) if (Math.abs(A[r * m + c]) > Math.abs(A[piv * m + c])) piv = r;
    if (!(Math.abs(A[piv * m + c]) > 0)) return false;
    if (piv !== c) {
      for (let k = 0; k < m; k++) {
        const t = A[c * m + k];
        A[c * m + k] = A[piv * m + k];
        A[piv * m + k] = t;
      }
      const t = b[c];
      b[c] = b[piv];
      b[piv] = t;
    }
    for (let r = c + 1; r < m; r++) {
      const f = A[r * m + c] / A[c * m + c];
      if (f === 0) continue;
      for (let k = c; k < m; k++) A[r * m + k] -= f * A[c * m + k];
      b[r] -= f * b[c];
    }
  }
  for (let r = m - 1; r >= 0; r--) {
    let sum = b[r];
    for (let k = r + 1; k < m; k++) sum -= A[r * m + k] * b[k];
    b[r] = sum / A[r * m + r];
  }
  return true;
}

/**
 * Isothermal flash at (P, T) inside the two-phase region: Rachford–Rice for β with successive
 * substitution on K. `guess` supplies starting K-values (e.g. from the bubble/dew points).
 */
export function flashPT(mix: MixtureModel, z: ArrayLike<number>, pPa: number, tK: number, guess: TwoPhaseSolution): TwoPhaseSolution {
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
