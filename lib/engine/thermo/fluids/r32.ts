/**
 * R32 (difluoromethane): Tillner-Roth, R., Yokozeki, A. (1997), "An International Standard
 * Equation of State for Difluoromethane for Temperatures from the Triple Point at
 * 136.34 K to 435 K and Pressures up to 70 MPa", J. Phys. Chem. Ref. Data 26, 1273–1328.
 * Coefficients transcribed from the public CoolProp fluid file dev/fluids/R32.json (which
 * cites the same paper, BibTeX key TillnerRoth-JPCRD-1997). Ancillary seeds: CoolProp's fits
 * in the same file. A blend component (mixture/), not a refrigerant offered on its own.
 */
import type { ComponentData } from "../mixture/component";

const M = 0.052024;

export const component: ComponentData = {
  id: "R32",
  name: "R32 (difluoromethane)",
  paper: "Tillner-Roth & Yokozeki (1997)",
  omega: 0.2769,
  criticalPressurePa: 5.782e6,
  tTripleK: 136.34,
  eos: {
    tReducingK: 351.255,
    rhoReducingKgM3: 8150.0846 * M,
    gasConstantJmolK: 8.314471,
    molarMassKgMol: M,
    ideal: {
      a1: -8.258096,
      a2: 6.353098,
      logTau: 3.004486,
      planckEinstein: { n: [1.160761, 2.645151, 5.794987, 1.129475], theta: [2.2718538, 11.914421, 5.1415638, 32.768217] },
    },
    power: {
      n: [
        1.046634, -0.5451165, -0.002448595, -0.04877002, 0.03520158, 0.00162275, 2.377225e-5, 0.029149, 0.003386203,
        -0.004202444, 0.0004782025, -0.005504323, -0.02418396, 0.4209034, -0.4616537, -1.200513, -2.59155, -1.400145,
        0.8263017,
      ],
      d: [1, 2, 5, 1, 1, 3, 8, 4, 4, 4, 8, 3, 5, 1, 1, 3, 1, 2, 3],
      t: [0.25, 1, -0.25, -1, 2, 2, 0.75, 0.25, 18, 26, -1, 25, 1.75, 4, 5, 1, 1.5, 1, 0.5],
      l: [0, 0, 0, 0, 0, 0, 0, 0, 4, 3, 1, 4, 1, 2, 2, 1, 1, 1, 1],
    },
  },
  ancillaries: {
    rhoL: {
      kind: "rhoL",
      reducing: 8150.0846 * M,
      tReducingK: 351.255,
      n: [3.0283368557227064, -13.30754793568124, 53.97035773548243, -41.10515088784585, 0.6410010855629815, -18.757652443918627],
      t: [0.358, 0.676, 0.831, 0.88, 2.592, 16.556],
      tauFactor: false,
    },
    rhoV: {
      kind: "rhoV",
      reducing: 8150.0846 * M,
      tReducingK: 351.255,
      n: [-0.06522522852577171, -3.3577643698607456, -2.746299718061842, -64.77289013657663, 511.3349286855849, -1525.315265366156],
      t: [0.069, 0.425, 1.18, 8.115, 12.06, 16.085],
      tauFactor: true,
    },
  },
};
