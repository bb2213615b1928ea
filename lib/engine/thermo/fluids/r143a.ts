/**
 * R143a (1,1,1-trifluoroethane): Lemmon, E. W., Jacobsen, R. T. (2000), "An International
 * Standard Formulation for the Thermodynamic Properties of 1,1,1-Trifluoroethane (HFC-143a)
 * for Temperatures from 161 to 450 K and Pressures to 50 MPa", J. Phys. Chem. Ref. Data 29,
 * 521–552. Coefficients transcribed from the public CoolProp fluid file dev/fluids/R143a.json
 * (BibTeX key LemmonJacobsen-JPCRD-2000). Its ideal-gas heat capacity has a term
 * cp0/R ∋ c·(T/K)^t (c = 1.0578, t = 0.33), which integrates to the α° term
 * −c·T_r^t/(t(t+1))·τ^(−t) (the constants and the τ-linear part it also produces only move the
 * reference state, which the IIR offsets absorb). A blend component, not offered on its own.
 */
import type { ComponentData } from "../mixture/component";

const M = 0.084041;
const TR = 345.857;
const C_POLY = 1.0578;
const T_POLY = 0.33;

export const component: ComponentData = {
  id: "R143a",
  name: "R143a (1,1,1-trifluoroethane)",
  paper: "Lemmon & Jacobsen (2000)",
  omega: 0.261489646224,
  criticalPressurePa: 3.761e6,
  tTripleK: 161.34,
  eos: {
    tReducingK: TR,
    rhoReducingKgM3: 5128.45 * M,
    gasConstantJmolK: 8.314472,
    molarMassKgMol: M,
    ideal: {
      a1: 5.903087,
      a2: 7.307253,
      logTau: -1,
      power: { n: [(-C_POLY * Math.pow(TR, T_POLY)) / (T_POLY * (T_POLY + 1))], t: [-T_POLY] },
      planckEinstein: { n: [4.4402, 3.7515], theta: [5.178440800677737, 2.379596191489546] },
    },
    power: {
      n: [
        7.7736443, -8.70185, -0.27779799, 0.1460922, 0.0089581616, -0.20552116, 0.10653258, 0.023270816, -0.013247542,
        -0.04279387, 0.36221685, -0.25671899, -0.092326113, 0.083774837, 0.017128445, -0.01725611, 0.0049080492,
      ],
      d: [1, 1, 1, 2, 5, 1, 3, 5, 7, 1, 2, 2, 3, 4, 2, 3, 5],
      t: [0.67, 0.833, 1.7, 1.82, 0.35, 3.9, 0.95, 0, 1.19, 7.2, 5.9, 7.65, 7.5, 7.45, 15.5, 22, 19],
      l: [0, 0, 0, 0, 0, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 3],
    },
  },
  ancillaries: {
    rhoL: {
      kind: "rhoL",
      reducing: 5128.45 * M,
      tReducingK: TR,
      n: [2.664780959919923, -0.254772168947589, 97.84474908938734, -105.1304757408368, 13272.94203979726, -116968.31229953805],
      t: [0.381, 0.463, 3.927, 4.049, 16.046, 19.95],
      tauFactor: false,
    },
    rhoV: {
      kind: "rhoV",
      reducing: 5128.45 * M,
      tReducingK: TR,
      n: [-6.218069939810391, 4.25938169894919, -4.417810181991655, 23.70234830311772, -50.98632502013336, 29.108143754921628],
      t: [0.454, 0.587, 1.058, 3.611, 4.279, 5.478],
      tauFactor: true,
    },
  },
};
