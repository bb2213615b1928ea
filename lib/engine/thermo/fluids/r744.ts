/**
 * R744 (carbon dioxide): Span, R., Wagner, W. (1996), "A New Equation of State for Carbon
 * Dioxide Covering the Fluid Region from the Triple-Point Temperature to 1100 K at Pressures
 * up to 800 MPa", J. Phys. Chem. Ref. Data 25, 1509–1596. All 42 residual terms (34
 * polynomial/exponential, 5 Gaussian, 3 non-analytic) and the Planck–Einstein ideal part.
 * Coefficients transcribed from the public CoolProp fluid file dev/fluids/CarbonDioxide.json
 * (which cites the same paper). Ancillary seeds: CoolProp's fits in the same file.
 * This module uses 216.592 K (triple point) … 500 K, ≤ 20 MPa.
 */
import { pureFluidMeta } from "../meta";
import type { PureFluidData } from "../helmholtz/pure-fluid";

const M = 0.0440098;

export const data: PureFluidData = {
  meta: pureFluidMeta.R744,
  range: { tMinK: 216.592, tMaxK: 500, pMaxPa: 20e6 },
  eos: {
    tReducingK: 304.1282,
    rhoReducingKgM3: 467.6,
    gasConstantJmolK: 8.31451,
    molarMassKgMol: M,
    ideal: {
      a1: 8.37304456,
      a2: -3.70454304,
      logTau: 2.5,
      planckEinstein: {
        n: [1.99427042, 0.62105248, 0.41195293, 1.04028922, 0.08327678],
        theta: [3.15163, 6.1119, 6.77708, 11.32384, 27.08792],
      },
    },
    power: {
      n: [
        0.388568232032, 2.93854759427, -5.5867188535, -0.767531995925, 0.317290055804, 0.548033158978,
        0.122794112203, 2.16589615432, 1.58417351097, -0.231327054055, 0.0581169164314, -0.553691372054,
        0.489466159094, -0.0242757398435, 0.0624947905017, -0.121758602252, -0.370556852701,
        -0.0167758797004, -0.11960736638, -0.0456193625088, 0.0356127892703, -0.00744277271321,
        -0.00173957049024, -0.0218101212895, 0.0243321665592, -0.0374401334235, 0.143387157569,
        -0.134919690833, -0.0231512250535, 0.0123631254929, 0.00210583219729, -0.000339585190264,
        0.00559936517716, -0.000303351180556,
      ],
      d: [1, 1, 1, 1, 2, 2, 3, 1, 2, 4, 5, 5, 5, 6, 6, 6, 1, 1, 4, 4, 4, 7, 8, 2, 3, 3, 5, 5, 6, 7, 8, 10, 4, 8],
      t: [
        0, 0.75, 1, 2, 0.75, 2, 0.75, 1.5, 1.5, 2.5, 0, 1.5, 2, 0, 1, 2, 3, 6, 3, 6, 8, 6, 0, 7, 12, 16, 22, 24, 16,
        24, 8, 2, 28, 14,
      ],
      l: [0, 0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 2, 2, 3, 3, 3, 4, 4, 4, 4, 4, 4, 5, 6],
    },
    gaussian: {
      n: [-213.654886883, 26641.5691493, -24027.2122046, -283.41603424, 212.472844002],
      d: [2, 2, 2, 3, 3],
      t: [1, 0, 1, 3, 3],
      eta: [25, 25, 25, 15, 20],
      epsilon: [1, 1, 1, 1, 1],
      beta: [325, 300, 300, 275, 275],
      gamma: [1.16, 1.19, 1.19, 1.25, 1.22],
    },
    nonAnalytic: {
      n: [-0.666422765408, 0.726086323499, 0.0550686686128],
      a: [3.5, 3.5, 3],
      b: [0.875, 0.925, 0.875],
      beta: [0.3, 0.3, 0.3],
      A: [0.7, 0.7, 0.7],
      B: [0.3, 0.3, 1],
      C: [10, 10, 12.5],
      D: [275, 275, 275],
    },
  },
  ancillaries: {
    rhoL: {
      kind: "rhoL",
      reducing: 10624.9063 * M,
      tReducingK: 304.1282,
      n: [0.861951794789174, 5.535795098719573, -21.766373764605415, 20.01416999278327, -2.2218647220786862, 888.2387848519858],
      t: [0.264, 0.672, 0.986, 1.092, 1.714, 9.902],
      tauFactor: false,
    },
    rhoV: {
      kind: "rhoV",
      reducing: 10624.9063 * M,
      tReducingK: 304.1282,
      n: [-1.1635587811569494, -3.64216164754343, 2.7773118075713237, -3.2573848494624533, -1.9739104682508852, -16.057319994659142],
      t: [0.306, 0.569, 0.677, 0.891, 3.206, 6.093],
      tauFactor: true,
    },
  },
};
