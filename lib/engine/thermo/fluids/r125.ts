/**
 * R125 (pentafluoroethane): Lemmon, E. W., Jacobsen, R. T. (2005), "A New Functional Form and
 * New Fitting Techniques for Equations of State with Application to Pentafluoroethane
 * (HFC-125)", J. Phys. Chem. Ref. Data 34, 69–108. Its last three terms carry the extra factor
 * exp(−τ^m) (the paper's new functional form; `m` in the power terms).
 * Coefficients transcribed from the public CoolProp fluid file dev/fluids/R125.json (which
 * cites the same paper, BibTeX key Lemmon-JPCRD-2005). Ancillary seeds: CoolProp's fits in
 * the same file. A blend component (mixture/), not a refrigerant offered on its own.
 */
import type { ComponentData } from "../mixture/component";

const M = 0.1200214;

export const component: ComponentData = {
  id: "R125",
  name: "R125 (pentafluoroethane)",
  paper: "Lemmon & Jacobsen (2005)",
  omega: 0.3052,
  criticalPressurePa: 3.6177e6,
  tTripleK: 172.52,
  eos: {
    tReducingK: 339.173,
    rhoReducingKgM3: 4779 * M,
    gasConstantJmolK: 8.314472,
    molarMassKgMol: M,
    ideal: {
      a1: 37.2674,
      a2: 8.88404,
      logTau: -1,
      power: { n: [-49.8651], t: [-0.1] },
      planckEinstein: { n: [2.303, 5.086, 7.3], theta: [0.92578, 2.22895, 5.03283] },
    },
    power: {
      n: [
        5.28076, -8.67658, 0.7501127, 0.7590023, 0.01451899, 4.777189, -3.330988, 3.775673, -2.290919, 0.8888268,
        -0.6234864, -0.04127263, -0.08455389, -0.1308752, 0.008344962, -1.532005, -0.05883649, 0.02296658,
      ],
      d: [1, 1, 1, 2, 4, 1, 1, 2, 2, 3, 4, 5, 1, 5, 1, 2, 3, 5],
      t: [0.669, 1.05, 2.75, 0.956, 1, 2, 2.75, 2.38, 3.37, 3.47, 2.63, 3.45, 0.72, 4.23, 0.2, 4.5, 29, 24],
      l: [0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 1, 1, 2, 2, 3, 2, 3, 3],
      m: [0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 1.7, 7, 6],
    },
  },
  ancillaries: {
    rhoL: {
      kind: "rhoL",
      reducing: 4779 * M,
      tReducingK: 339.173,
      n: [2.2016016101218163, 9.66884730895765, -38.74092529625786, 45.90185095955414, -68.77471029167359, 3782.012676140688],
      t: [0.356, 2.347, 3.224, 4.03, 7.525, 16.03],
      tauFactor: false,
    },
    rhoV: {
      kind: "rhoV",
      reducing: 4779 * M,
      tReducingK: 339.173,
      n: [-2.0301408267555248, -1.7694859385413004, -2.66520428063493, -2012.3802928260302, 4435.166819598504, -67300.56720486972],
      t: [0.352, 0.604, 1.327, 9.866, 10.986, 18.158],
      tauFactor: true,
    },
  },
};
