/**
 * R134a: Tillner-Roth, R., Baehr, H. D. (1994), "An International Standard Formulation for
 * the Thermodynamic Properties of 1,1,1,2-Tetrafluoroethane (HFC-134a) for Temperatures from
 * 170 K to 455 K and Pressures up to 70 MPa", J. Phys. Chem. Ref. Data 23, 657–729.
 * Coefficients transcribed from the public CoolProp fluid file dev/fluids/R134a.json (which
 * cites the same paper). Ancillary seeds: CoolProp's fits in the same file.
 * This module uses 169.85 K (triple point) … 455 K, ≤ 20 MPa.
 */
import { pureFluidMeta } from "../meta";
import type { PureFluidData } from "../helmholtz/pure-fluid";

const M = 0.102032;

export const data: PureFluidData = {
  meta: pureFluidMeta.R134a,
  range: { tMinK: 169.85, tMaxK: 455, pMaxPa: 20e6 },
  eos: {
    tReducingK: 374.18,
    rhoReducingKgM3: 4978.830171 * M,
    gasConstantJmolK: 8.314471,
    molarMassKgMol: M,
    ideal: {
      a1: -1.019535,
      a2: 9.047135,
      logTau: -1.629789,
      power: { n: [-9.723916, -3.92717], t: [-0.5, -0.75] },
    },
    power: {
      n: [
        0.05586817, 0.498223, 0.02458698, 0.0008570145, 0.0004788584, -1.800808, 0.2671641, -0.04781652,
        0.01423987, 0.3324062, -0.007485907, 0.0001017263, -0.5184567, -0.08692288, 0.2057144, -0.005000457,
        0.0004603262, -0.003497836, 0.006995038, -0.01452184, -0.0001285458,
      ],
      d: [2, 1, 3, 6, 6, 1, 1, 2, 5, 2, 2, 4, 1, 4, 1, 2, 4, 1, 5, 3, 10],
      t: [-0.5, 0, 0, 0, 1.5, 1.5, 2, 2, 1, 3, 5, 1, 5, 5, 6, 10, 10, 10, 18, 22, 50],
      l: [0, 0, 0, 0, 0, 0, 0, 0, 1, 1, 1, 2, 2, 2, 2, 2, 2, 3, 3, 3, 4],
    },
  },
  ancillaries: {
    rhoL: {
      kind: "rhoL",
      reducing: 5017.053 * M,
      tReducingK: 374.21,
      n: [18.772731940930015, -51.49939472178225, 40.793536440596085, -1481.6500471538966, 1600.534434298925, -67338.52423732559],
      t: [0.673, 0.994, 1.257, 5.783, 5.943, 19.94],
      tauFactor: false,
    },
    rhoV: {
      kind: "rhoV",
      reducing: 5017.053 * M,
      tReducingK: 374.21,
      n: [-5.147386240766544, 5.34618043286371, -7.611015272838434, -28.85436432788653, -9.079306067130748, 64.0],
      t: [0.476, 0.966, 1.321, 8.491, 13.463, 13.463],
      tauFactor: true,
    },
  },
};
