/**
 * Pure-component parameters of the Peng–Robinson model for the blend components.
 *
 * Critical constants, acentric factors and molar masses are those of each component's
 * reference Helmholtz equation of state (named in `eos`), as CoolProp 8.0.0 reports them.
 * The fitted parameters come from `fixtures/fit_components.py` (committed, rerunnable):
 * - `mc`: coefficients c1…c5 of the Mathias–Copeman alpha function (Mathias & Copeman, Fluid
 *   Phase Equilib. 13, 1983), extended from three to five terms: weighted least-squares fit
 *   (weights that make it a fit on ln Psat) to the alpha that makes PR reproduce the
 *   reference saturation pressure, 203 K to 0.96·Tc;
 * - `penelouxM3Mol`: Péneloux et al. (Fluid Phase Equilib. 8, 1982) constant volume shift,
 *   mean PR-minus-reference saturated-liquid volume over 230…320 K;
 * - `cp0`: ideal-gas heat capacity cp0/R = Σ a_k·(T/100 K)^k, k = 0…4, fitted over
 *   150…520 K to the ideal-gas part of the reference equation (max deviation `cp0MaxRelErr`).
 */
export interface CubicComponent {
  id: ComponentId;
  tcK: number;
  pcPa: number;
  omega: number;
  molarMassKgMol: number;
  mc: readonly number[];
  penelouxM3Mol: number;
  cp0: readonly number[];
  cp0MaxRelErr: number;
  /** Reference equation of state the parameters were fitted to. */
  eos: string;
}

export type ComponentId = "R32" | "R125" | "R134a" | "R143a" | "R1234yf" | "R1234zeE";

export const COMPONENTS: Record<ComponentId, CubicComponent> = {
  R32: {
    id: "R32",
    tcK: 351.255,
    pcPa: 5782645.1,
    omega: 0.2769,
    molarMassKgMol: 0.052024,
    mc: [0.8584955363722232, -1.4340700870982703, 10.429993680654372, -36.45191164235733, 49.263221183598176],
    penelouxM3Mol: 7.623442e-06,
    cp0: [4.46548223275105, -0.807127103660362, 0.474063003650879, -0.042641864173788374, 0.00031399957631706604],
    cp0MaxRelErr: 0.0018,
    eos: "Tillner-Roth & Yokozeki, J. Phys. Chem. Ref. Data 26 (1997)",
  },
  R125: {
    id: "R125",
    tcK: 339.1772824561048,
    pcPa: 3618276.06,
    omega: 0.3052,
    molarMassKgMol: 0.1200214,
    mc: [0.8735539410759389, -1.4434030171110819, 12.643757651761462, -46.945191618523076, 66.98022727732831],
    penelouxM3Mol: 3.453002e-07,
    cp0: [2.7126457565353244, 3.584104851904037, -0.2700241669846406, 0.01889223806545975, -0.0017593638668218629],
    cp0MaxRelErr: 0.0006,
    eos: "Lemmon & Jacobsen, J. Phys. Chem. Ref. Data 34 (2005)",
  },
  R134a: {
    id: "R134a",
    tcK: 374.2119665849513,
    pcPa: 4059276.37,
    omega: 0.32684,
    molarMassKgMol: 0.102032,
    mc: [0.907664631617524, -1.338127781465061, 10.466877274430805, -34.821583938412275, 44.19190894470511],
    penelouxM3Mol: 1.747243e-06,
    cp0: [1.5122534933699554, 4.086810751118674, -0.5661649403066638, 0.07034356758853301, -0.003804847935910718],
    cp0MaxRelErr: 0.0004,
    eos: "Tillner-Roth & Baehr, J. Phys. Chem. Ref. Data 23 (1994)",
  },
  R143a: {
    id: "R143a",
    tcK: 345.85700086786187,
    pcPa: 3761818.27,
    omega: 0.261489646224,
    molarMassKgMol: 0.084041,
    mc: [0.8322325224769135, -1.526489177347187, 11.942697495512295, -42.83419558479253, 59.485805987175375],
    penelouxM3Mol: 5.944199e-06,
    cp0: [2.387052072756537, 2.267784315036901, 0.17783127472886212, -0.06290394539673361, 0.004159308451717968],
    cp0MaxRelErr: 0.0010,
    eos: "Lemmon & Jacobsen, J. Phys. Chem. Ref. Data 29 (2000)",
  },
  R1234yf: {
    id: "R1234yf",
    tcK: 367.85,
    pcPa: 3384373.70,
    omega: 0.276,
    molarMassKgMol: 0.1140416,
    mc: [0.8427533404570077, -1.3638680705916595, 10.337304110403341, -34.16707982235385, 43.552271621308456],
    penelouxM3Mol: 2.194997e-07,
    cp0: [0.07934571538773628, 6.612525297093074, -1.3414530413797445, 0.20732398432623095, -0.014429765156676258],
    cp0MaxRelErr: 0.0037,
    eos: "Lemmon & Akasaka, Int. J. Thermophys. 43 (2022)",
  },
  R1234zeE: {
    id: "R1234zeE",
    tcK: 382.51300260465183,
    pcPa: 3634870.52,
    omega: 0.3131224184598984,
    molarMassKgMol: 0.1140415928,
    mc: [0.8835129738850686, -1.1673870660022505, 8.731277300775828, -27.839807711826, 34.57011279089904],
    penelouxM3Mol: -1.369878e-06,
    cp0: [-2.765764460601453, 11.284766088851185, -3.685923101403983, 0.6544071108703219, -0.04378893913536241],
    cp0MaxRelErr: 0.0032,
    eos: "Thol & Lemmon, Int. J. Thermophys. 37 (2016)",
  },
};
