/**
 * R717 (ammonia): Tillner-Roth, R., Harms-Watzenberg, F., Baehr, H. D. (1993), "Eine neue
 * Fundamentalgleichung für Ammoniak", DKV-Tagungsbericht 20, 167–181; tabulated in Baehr &
 * Tillner-Roth (1995), "Thermodynamic Properties of Environmentally Acceptable Refrigerants",
 * Springer. Coefficients as printed there and as carried by Debian's python3-iapws
 * (iapws/ammonia.py, class NH3). Ancillaries for ρ' and ρ'' (seeds only) from the same source.
 * Valid 196–700 K, up to 1000 MPa; this module uses 196–700 K (the whole temperature range,
 * so a single-stage discharge far above any compressor's limit can still be computed and
 * flagged), ≤ 25 MPa.
 */
import { pureFluidMeta } from "../meta";
import type { PureFluidData } from "../helmholtz/pure-fluid";

export const data: PureFluidData = {
  meta: pureFluidMeta.R717,
  range: { tMinK: 196, tMaxK: 700, pMaxPa: 25e6 },
  eos: {
    tReducingK: 405.4,
    rhoReducingKgM3: 225,
    gasConstantJmolK: 8.314471,
    molarMassKgMol: 0.01703026,
    ideal: {
      a1: -15.81502,
      a2: 4.255726,
      logTau: -1,
      power: { n: [11.47434, -1.296211, 0.5706757], t: [1 / 3, -1.5, -1.75] },
    },
    power: {
      n: [
        -0.1858814e1, 0.4554431e-1, 0.7238548, 0.122947e-1, 0.2141882e-10, -0.143002e-1, 0.3441324,
        -0.2873571, 0.2352589e-4, -0.3497111e-1, 0.1831117e-2, 0.2397852e-1, -0.4085375e-1, 0.2379275,
        -0.3548972e-1, -0.1823729, 0.2281556e-1, -0.6663444e-2, -0.8847486e-2, 0.2272635e-2, -0.5588655e-3,
      ],
      d: [1, 2, 1, 4, 15, 3, 3, 1, 8, 2, 8, 1, 1, 2, 3, 2, 4, 3, 1, 2, 4],
      t: [1.5, -0.5, 0.5, 1, 3, 0, 3, 4, 4, 5, 5, 3, 6, 8, 8, 10, 10, 5, 7.5, 15, 30],
      l: [0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 2, 2, 3, 3, 3, 3],
    },
  },
  ancillaries: {
    rhoL: {
      kind: "rhoL",
      reducing: 225,
      tReducingK: 405.4,
      n: [0.34488e2, -0.12849e3, 0.17382e3, -0.10699e3, 0.30339e2],
      t: [0.58, 0.75, 0.9, 1.1, 1.3],
      tauFactor: false,
    },
    rhoV: {
      kind: "rhoV",
      reducing: 225,
      tReducingK: 405.4,
      n: [-0.38435, -4.0846, -6.6634, -0.31881e2, 0.21306e3, -0.24648e3],
      t: [0.218, 0.55, 1.5, 3.7, 5.5, 5.8],
      tauFactor: false,
    },
  },
};
