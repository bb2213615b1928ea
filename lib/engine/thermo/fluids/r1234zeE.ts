/**
 * R1234ze(E): Thol, M., Lemmon, E. W. (2016), "Equation of State for the Thermodynamic
 * Properties of trans-1,3,3,3-Tetrafluoropropene [R-1234ze(E)]", Int. J. Thermophys. 37:28.
 * Coefficients transcribed from the public CoolProp fluid file dev/fluids/R1234ze(E).json
 * (its first equation, which cites the same paper; reducing T = 382.513 K). Ancillary
 * seeds: CoolProp's fits in the same file. The ideal-gas constants a1, a2 are arbitrary
 * (zero): the IIR reference state is applied by offsets.
 * This module uses 168.62 K (triple point) … 420 K, ≤ 20 MPa.
 */
import { pureFluidMeta } from "../meta";
import type { PureFluidData } from "../helmholtz/pure-fluid";

const M = 0.1140415928;

export const data: PureFluidData = {
  meta: pureFluidMeta.R1234zeE,
  range: { tMinK: 168.62, tMaxK: 420, pMaxPa: 20e6 },
  eos: {
    tReducingK: 382.513,
    rhoReducingKgM3: 4290 * M,
    gasConstantJmolK: 8.314472,
    molarMassKgMol: M,
    ideal: {
      a1: 0,
      a2: 0,
      logTau: 3,
      planckEinstein: { n: [9.3575, 10.717], theta: [1.34113088966911, 5.15538034001459] },
    },
    power: {
      n: [0.03982797, 1.812227, -2.537512, -0.5333254, 0.1677031, -1.323801, -0.6694654, 0.8072718, -0.7740229, -0.01843846],
      d: [4, 1, 1, 2, 3, 1, 3, 2, 2, 7],
      t: [1, 0.223, 0.755, 1.24, 0.44, 2, 2.2, 1.2, 1.5, 0.9],
      l: [0, 0, 0, 0, 0, 2, 2, 1, 2, 1],
    },
    gaussian: {
      n: [1.407916, -0.4237082, -0.2270068, -0.805213, 0.00994318, -0.008798793],
      d: [1, 1, 3, 3, 2, 1],
      t: [1.33, 1.75, 2.11, 1, 1.5, 1],
      eta: [1, 1.61, 1.24, 9.34, 5.78, 3.08],
      epsilon: [0.728, 0.87, 0.855, 0.79, 1.3, 0.71],
      beta: [1.21, 1.37, 0.98, 171, 47.4, 15.4],
      gamma: [0.943, 0.642, 0.59, 1.2, 1.33, 0.64],
    },
  },
  ancillaries: {
    rhoL: {
      kind: "rhoL",
      reducing: 4290 * M,
      tReducingK: 382.52,
      n: [-8.42282936179494, 35.592169315198404, -27.748444759203856, 3.0869391194586315, 0.49297732386262993, 2436.2254360953007],
      t: [0.07, 0.096, 0.108, 0.383, 2.6666666666666665, 25.0],
      tauFactor: false,
    },
    rhoV: {
      kind: "rhoV",
      reducing: 4290 * M,
      tReducingK: 382.52,
      n: [1.9861295422409955, -3.601910664347684, 110.97544193749978, -113.63727224413014, -1.7016720393939881, -5.765500312051858],
      t: [0.105, 0.139, 0.3875, 0.3945, 1.3333333333333333, 4.166666666666667],
      tauFactor: true,
    },
  },
};
