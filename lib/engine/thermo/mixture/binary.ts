/**
 * Binary parameters of the multi-fluid mixture model (Kunz & Wagner, J. Chem. Eng. Data 57,
 * 3032–3091, 2012, "GERG-2008" form): reducing-function parameters β_T, γ_T, β_v, γ_v, the
 * departure-function weight F_ij and the departure function itself, for every pair of the
 * components the blends here contain. Transcribed from the public CoolProp files
 * dev/mixtures/mixture_binary_pairs.json and dev/mixtures/mixture_departure_functions.json;
 * the source of each pair is the reference the file gives for it:
 *
 * - HFC pairs: Lemmon, E. W., Jacobsen, R. T. (2004), "Equations of State for Mixtures of
 *   R-134a, R-143a, and R-152a", J. Phys. Chem. Ref. Data 33, 593–620. Their
 *   reducing functions are T_r = Σ x_i T_c,i + Σ x_i x_j ξ_ij and
 *   v_r = Σ x_i v_c,i + Σ x_i x_j ζ_ij, which on Σx = 1 equal the Kunz–Wagner form with
 *   β = 1, γ_T = (T_c,i + T_c,j + ξ_ij)/(2√(T_c,i T_c,j)),
 *   γ_v = (v_c,i + v_c,j + ζ_ij)/(2·(v_c,i^⅓ + v_c,j^⅓)³/8) (converted in `reducingOf`).
 * - R32/R1234yf and R32/R1234ze(E): Akasaka, R. (2013), Fluid Phase Equilib. (file key
 *   Akasaka-FPE-2013), using the departure-function shapes of Kunz & Wagner's methane/CO2 and
 *   methane/propane pairs.
 * - R1234yf with R125 and R134a, and CO2 (R744) with R32 and R1234yf: Bell, I. H., Lemmon,
 *   E. W. (2016), "Automatic Fitting of Binary Interaction Parameters for Multi-fluid
 *   Helmholtz-Energy-Explicit Mixture Models", J. Chem. Eng. Data 61, 3752–3760 (β_T, γ_T only,
 *   β_v = γ_v = 1, no departure function).
 * - R1234ze(E) with R125, R134a and R1234yf: no usable parameters (R1234yf/R1234ze(E) and
 *   R134a/R1234ze(E) are in a later pairs file, Bell et al. 2022, but fitted with departure
 *   functions no readable version of the departure file has; R125/R1234ze(E) was found
 *   nowhere); they run on the Lorentz–Berthelot default (all four parameters 1, F = 0), the
 *   model's own fallback. R1234ze(E) is 7 % of R448A and in no other blend here; the thermo
 *   README gives what the gap can cost.
 *
 * A later version of the same pairs file replaces the HFO pairs by the fits of Bell et al.
 * (J. Phys. Chem. Ref. Data 2022 and 2023: R32/R1234yf, R32/R1234ze(E), R125/R1234yf,
 * R1234yf/R134a, R1234yf/R1234ze(E), R134a/R1234ze(E)), each with its own departure function;
 * those departure functions were not in any version of the departure-function file that could
 * be read, and reducing parameters fitted together with a departure function are not used
 * without it, so the earlier published set above is kept.
 */
import type { ComponentId } from "./component";

/** One departure-function term: n·δ^d·τ^t·exp(−δ^l − η(δ−ε)² − β(δ−γ)). */
export interface DepartureFunction {
  name: string;
  n: readonly number[];
  d: readonly number[];
  t: readonly number[];
  /** exp(−δ^l) exponent (0 = none): the "Exponential" form of Lemmon & Jacobsen. */
  l: readonly number[];
  /** The GERG-2008 form's exp(−η(δ−ε)² − β(δ−γ)); zero η and β = pure power term. */
  eta: readonly number[];
  epsilon: readonly number[];
  beta: readonly number[];
  gamma: readonly number[];
}

const zeros = (k: number) => Array.from({ length: k }, () => 0);

function exponential(name: string, n: number[], t: number[], d: number[], l: number[]): DepartureFunction {
  const z = zeros(n.length);
  return { name, n, t, d, l, eta: z, epsilon: z, beta: z, gamma: z };
}

export const DEPARTURE: Record<string, DepartureFunction> = {
  "R32-R125": exponential(
    "R32-R125",
    [-0.0072955, 0.078035, 0.61007, 0.64246, 0.014965, -0.34049, 0.085658, -0.064429],
    [4.5, 0.57, 1.9, 1.2, 0.5, 2.6, 11.4, 4.5],
    [2, 5, 1, 3, 9, 2, 3, 6],
    [1, 1, 2, 2, 2, 3, 3, 3],
  ),
  "R32-R134a": exponential("R32-R134a", [0.22909, 0.094074, 0.00039876, 0.021113], [1.9, 0.25, 0.07, 2.0], [1, 3, 8, 1], [1, 1, 1, 2]),
  GeneralizedHFC: exponential("GeneralizedHFC", [-0.013073, 0.018259, 0.0000081299, 0.0078496], [7.4, 0.35, 10.0, 5.3], [1, 3, 11, 2], [1, 1, 3, 2]),
  // Kunz & Wagner (2012) methane/CO2 and methane/propane departure functions (file names
  // "Methane-CarbonDioxide", "Methane-Propane"), reused by Akasaka (2013) for the HFO pairs.
  "Methane-CarbonDioxide": {
    name: "Methane-CarbonDioxide",
    n: [-0.10859387354942, 0.080228576727389, -0.0093303985115717, 0.040989274005848, -0.24338019772494, 0.23855347281124],
    d: [1, 2, 3, 1, 2, 3],
    t: [2.6, 1.95, 0.0, 3.95, 7.95, 8.0],
    l: zeros(6),
    eta: [0, 0, 0, 1.0, 0.5, 0],
    epsilon: [0, 0, 0, 0.5, 0.5, 0.5],
    beta: [0, 0, 0, 1.0, 2.0, 3.0],
    gamma: [0, 0, 0, 0.5, 0.5, 0.5],
  },
  "Methane-Propane": {
    name: "Methane-Propane",
    n: [0.013746429958576, -0.0074425012129552, -0.0045516600213685, -0.0054546603350237, 0.0023682016824471, 0.18007763721438, -0.44773942932486, 0.0193273748882, -0.30632197804624],
    d: [3, 3, 4, 4, 4, 1, 1, 1, 2],
    t: [1.85, 3.95, 0.0, 1.85, 3.85, 5.25, 3.85, 0.2, 6.5],
    l: zeros(9),
    eta: [0, 0, 0, 0, 0, 0.25, 0.25, 0, 0],
    epsilon: [0, 0, 0, 0, 0, 0.5, 0.5, 0.5, 0.5],
    beta: [0, 0, 0, 0, 0, 0.75, 1.0, 2.0, 3.0],
    gamma: [0, 0, 0, 0, 0, 0.5, 0.5, 0.5, 0.5],
  },
};

/** Parameters of an ordered pair (i, j); the reverse pair uses 1/β and the same γ, F. */
export type BinaryParams =
  | { kind: "KW"; betaT: number; gammaT: number; betaV: number; gammaV: number; F: number; fn?: string; source: string }
  | { kind: "LJ"; xi: number; zetaM3Mol: number; F: number; fn?: string; source: string };

const LJ2004 = "Lemmon & Jacobsen (2004)";
const AKASAKA = "Akasaka (2013)";
const BELL2016 = "Bell & Lemmon (2016)";

/** Keyed "A/B" in the file's order (A is component i). */
export const BINARY: Record<string, BinaryParams> = {
  "R32/R125": { kind: "LJ", xi: 28.95, zetaM3Mol: -6.008e-6, F: 1.0, fn: "R32-R125", source: LJ2004 },
  "R32/R134a": { kind: "LJ", xi: 7.909, zetaM3Mol: -2.039e-6, F: 1.0, fn: "R32-R134a", source: LJ2004 },
  "R125/R134a": { kind: "LJ", xi: -0.4326, zetaM3Mol: -3.453e-7, F: 1.0, fn: "GeneralizedHFC", source: LJ2004 },
  "R125/R143a": { kind: "LJ", xi: 5.551, zetaM3Mol: -4.452e-7, F: 1.1697, fn: "GeneralizedHFC", source: LJ2004 },
  "R134a/R143a": { kind: "LJ", xi: 2.324, zetaM3Mol: 6.182e-7, F: 0.5557, fn: "GeneralizedHFC", source: LJ2004 },
  "R32/R1234yf": { kind: "KW", betaT: 1.00052, gammaT: 0.948538, betaV: 0.993346, gammaV: 1.02211, F: -0.277708, fn: "Methane-CarbonDioxide", source: AKASAKA },
  "R32/R1234zeE": { kind: "KW", betaT: 1.00343, gammaT: 0.977857, betaV: 1.00586, gammaV: 0.982707, F: -0.265419, fn: "Methane-Propane", source: AKASAKA },
  "R1234yf/R125": { kind: "KW", betaT: 0.99915, gammaT: 0.99876, betaV: 1, gammaV: 1, F: 0, source: BELL2016 },
  "R1234yf/R134a": { kind: "KW", betaT: 0.99972, gammaT: 0.98643, betaV: 1, gammaV: 1, F: 0, source: BELL2016 },
  "R1234yf/R143a": { kind: "KW", betaT: 1.00024, gammaT: 0.99523, betaV: 1, gammaV: 1, F: 0, source: BELL2016 },
  "R744/R32": { kind: "KW", betaT: 1.00312, gammaT: 0.99971, betaV: 1, gammaV: 1, F: 0, source: BELL2016 },
  "R744/R1234yf": { kind: "KW", betaT: 1.01128, gammaT: 0.98477, betaV: 1, gammaV: 1, F: 0, source: BELL2016 },
  "R744/R125": { kind: "KW", betaT: 1.0115, gammaT: 0.96741, betaV: 1, gammaV: 1, F: 0, source: BELL2016 },
  "R744/R134a": { kind: "KW", betaT: 1.01036, gammaT: 1.01129, betaV: 1, gammaV: 1, F: 0, source: BELL2016 },
  "R744/R143a": { kind: "KW", betaT: 1.02027, gammaT: 0.98474, betaV: 1, gammaV: 1, F: 0, source: BELL2016 },
  "R744/R1234zeE": { kind: "KW", betaT: 1.00219, gammaT: 1.02234, betaV: 1, gammaV: 1, F: 0, source: BELL2016 },
};

/** Kunz–Wagner reducing parameters and departure weight of the ordered pair (a, b). */
export interface PairReducing {
  betaT: number;
  gammaT: number;
  betaV: number;
  gammaV: number;
  F: number;
  fn?: DepartureFunction;
  source: string;
}

/**
 * The pair's parameters in the Kunz–Wagner form for the order (a, b), converting the
 * Lemmon–Jacobsen ξ/ζ form; `tc`, `vc` are the components' reducing temperature (K) and molar
 * volume (m³/mol). Pairs without published parameters get the Lorentz–Berthelot default.
 */
export function reducingOf(a: ComponentId, b: ComponentId, tc: [number, number], vc: [number, number]): PairReducing {
  const fwd = BINARY[`${a}/${b}`];
  const rev = BINARY[`${b}/${a}`];
  const p = fwd ?? rev;
  if (!p) return { betaT: 1, gammaT: 1, betaV: 1, gammaV: 1, F: 0, source: "Lorentz–Berthelot default (no published parameters in the source file)" };
  const fn = p.fn ? DEPARTURE[p.fn] : undefined;
  if (p.kind === "LJ") {
    const gammaT = (tc[0] + tc[1] + p.xi) / (2 * Math.sqrt(tc[0] * tc[1]));
    const c = Math.cbrt(vc[0]) + Math.cbrt(vc[1]);
    const gammaV = (vc[0] + vc[1] + p.zetaM3Mol) / ((2 * c * c * c) / 8);
    return { betaT: 1, gammaT, betaV: 1, gammaV, F: p.F, fn, source: p.source };
  }
  return fwd
    ? { betaT: p.betaT, gammaT: p.gammaT, betaV: p.betaV, gammaV: p.gammaV, F: p.F, fn, source: p.source }
    : { betaT: 1 / p.betaT, gammaT: p.gammaT, betaV: 1 / p.betaV, gammaV: p.gammaV, F: p.F, fn, source: p.source };
}
