/**
 * R290 (propane): Lemmon, E. W., McLinden, M. O., Wagner, W. (2009), "Thermodynamic
 * Properties of Propane. III. A Reference Equation of State for Temperatures from the Melting
 * Line to 650 K and Pressures up to 1000 MPa", J. Chem. Eng. Data 54, 3141–3180.
 * Coefficients transcribed from the public CoolProp fluid file dev/fluids/n-Propane.json
 * (which cites the same paper). Ancillary seeds: CoolProp's fits in the same file.
 * This module uses 85.525 K (triple point) … 500 K, ≤ 20 MPa.
 */
import { pureFluidMeta } from "../meta";
import type { PureFluidData } from "../helmholtz/pure-fluid";

const M = 0.04409562;

export const data: PureFluidData = {
  meta: pureFluidMeta.R290,
  range: { tMinK: 85.525, tMaxK: 500, pMaxPa: 20e6 },
  eos: {
    tReducingK: 369.89,
    rhoReducingKgM3: 5000 * M,
    gasConstantJmolK: 8.314472,
    molarMassKgMol: M,
    ideal: {
      a1: -4.970583,
      a2: 4.29352,
      logTau: 3,
      planckEinstein: { n: [3.043, 5.874, 9.337, 7.922], theta: [1.062478, 3.344237, 5.363757, 11.762957] },
    },
    power: {
      n: [
        0.042910051, 1.7313671, -2.4516524, 0.34157466, -0.46047898, -0.66847295, 0.20889705, 0.19421381,
        -0.22917851, -0.60405866, 0.066680654,
      ],
      d: [4, 1, 1, 2, 2, 1, 3, 6, 6, 2, 3],
      t: [1, 0.33, 0.8, 0.43, 0.9, 2.46, 2.09, 0.88, 1.09, 3.25, 4.62],
      l: [0, 0, 0, 0, 0, 1, 1, 1, 1, 2, 2],
    },
    gaussian: {
      n: [0.017534618, 0.33874242, 0.22228777, -0.23219062, -0.09220694, -0.47575718, -0.017486824],
      d: [1, 1, 1, 2, 2, 4, 1],
      t: [0.76, 2.5, 2.75, 3.05, 2.55, 8.4, 6.75],
      eta: [0.963, 1.977, 1.917, 2.307, 2.546, 3.28, 14.6],
      epsilon: [1.283, 0.6936, 0.788, 0.473, 0.8577, 0.271, 0.948],
      beta: [2.33, 3.47, 3.15, 3.19, 0.92, 18.8, 547.8],
      gamma: [0.684, 0.829, 1.419, 0.817, 1.5, 1.426, 1.093],
    },
  },
  ancillaries: {
    rhoL: {
      kind: "rhoL",
      reducing: 5000 * M,
      tReducingK: 369.89,
      n: [2.104068052280433, 0.3371892411622086, 0.4401223810964251, -3.5679018989260567, 59.93889697061387, -70.9402469085883],
      t: [0.368, 0.875, 3.009, 9.51, 15.381, 17.001],
      tauFactor: false,
    },
    rhoV: {
      kind: "rhoV",
      reducing: 5000 * M,
      tReducingK: 369.89,
      n: [-3.401360845132903, -1.9443653795380451, -0.4101211459709529, -15.598374206544214, 15.844867806184942, -15.298907422332046],
      t: [0.431, 1.339, 2.091, 6.822, 8.214, 19.706],
      tauFactor: true,
    },
  },
};
