/**
 * R1234yf (2,3,3,3-tetrafluoroprop-1-ene): Richter, M., McLinden, M. O., Lemmon, E. W. (2011),
 * "Thermodynamic Properties of 2,3,3,3-Tetrafluoroprop-1-ene (R1234yf): Vapor Pressure and
 * p-ρ-T Measurements and an Equation of State", J. Chem. Eng. Data 56, 3254–3264 — the
 * equation of the public CoolProp fluid file dev/fluids/R1234yf.json (BibTeX key
 * Richter-JCED-2011), from which the coefficients are transcribed (10 power and 5 Gaussian
 * terms). The later Lemmon & Akasaka (2022) equation is not used. The paper's range starts at
 * the triple point, 220 K; blend states go to 213.15 K, where the mixture model evaluates the
 * equation slightly below it (as the reference mixture model does). A blend component.
 */
import type { ComponentData } from "../mixture/component";

const M = 0.1140415928;

export const component: ComponentData = {
  id: "R1234yf",
  name: "R1234yf (2,3,3,3-tetrafluoropropene)",
  paper: "Richter, McLinden & Lemmon (2011)",
  omega: 0.276,
  criticalPressurePa: 3.3822e6,
  tTripleK: 220,
  eos: {
    tReducingK: 367.85,
    rhoReducingKgM3: 4170 * M,
    gasConstantJmolK: 8.314472,
    molarMassKgMol: M,
    ideal: {
      a1: -12.837928,
      a2: 8.042605,
      logTau: 4.944,
      planckEinstein: {
        n: [7.549, 1.537, 2.03, 7.455],
        theta: [1.951882560826424, 2.384123963572108, 12.13809976892755, 4.770966426532554],
      },
    },
    power: {
      n: [0.04592563, 1.546958, -2.355237, -0.4827835, 0.1758022, -1.210006, -0.6177084, 0.6805262, -0.6968555, -0.02695779],
      d: [4, 1, 1, 2, 3, 1, 3, 2, 2, 7],
      t: [1, 0.32, 0.929, 0.94, 0.38, 2.28, 1.76, 0.97, 2.44, 1.05],
      l: [0, 0, 0, 0, 0, 2, 2, 1, 2, 1],
    },
    gaussian: {
      n: [1.389966, -0.4777136, -0.1975184, -1.147646, 0.0003428541],
      d: [1, 1, 3, 3, 2],
      t: [1.4, 3, 3.5, 1, 3.5],
      eta: [1.02, 1.336, 1.055, 5.84, 16.2],
      epsilon: [0.712, 0.91, 0.677, 0.718, 1.64],
      beta: [1.42, 2.31, 0.89, 80, 108],
      gamma: [1.13, 0.67, 0.46, 1.28, 1.2],
    },
  },
  ancillaries: {
    rhoL: {
      kind: "rhoL",
      reducing: 4170 * M,
      tReducingK: 367.85,
      n: [2.321825326575359, -3.520638555089873, 20.18646332917161, -160.37050775728997, 147.68109685289284, -63578.64918999199],
      t: [0.365, 1.247, 1.765, 2.484, 2.593, 16.586],
      tauFactor: false,
    },
    rhoV: {
      kind: "rhoV",
      reducing: 4170 * M,
      tReducingK: 367.85,
      n: [-3.24158284550283, 2.612924555839616, -26.216566273272992, 115.70400813769207, -101.3078910128961, 9.031472717572315],
      t: [0.398, 0.952, 1.466, 2.053, 2.242, 4.989],
      tauFactor: true,
    },
  },
};
