import { loadFluid } from "@/lib/engine/thermo/index";
import type { HelmholtzFluid } from "@/lib/engine/thermo/helmholtz/pure-fluid";
const co2 = (await loadFluid("R744")) as HelmholtzFluid;
const r134 = (await loadFluid("R134a")) as HelmholtzFluid;
const ze = (await loadFluid("R1234zeE")) as HelmholtzFluid;
const c3 = (await loadFluid("R290")) as HelmholtzFluid;
console.log("co2 anchor rho", co2.statePT(12034846.936049871, 334.54102).densityKgM3 / 0.0440098, "want 9562.41567");
console.log("r134 anchor rho", r134.statePT(6858750.808053112, 411.598).densityKgM3 / 0.102032, "want 4480.9471539");
for (const tc of [-40, -20, 0, 20]) { const s = co2.saturationAtT(273.15 + tc); console.log("co2", tc, s.pDewPa, (s.vapour.hJkg - s.liquid.hJkg) / 1e3, s.liquid.hJkg/1e3, s.vapour.hJkg/1e3); }
// Cengel 11-1
const s1 = r134.saturationAtP(0.14e6).vapour, l3 = r134.saturationAtP(0.8e6).liquid;
const h2 = r134.statePS(0.8e6, s1.sJkgK);
console.log("cengel", s1.hJkg/1e3, h2.hJkg/1e3, l3.hJkg/1e3, "dh", (h2.hJkg - s1.hJkg)/1e3, "COP", (s1.hJkg - l3.hJkg)/(h2.hJkg - s1.hJkg), h2.tK - 273.15);
const nb = c3.saturationAtP(101325); console.log("c3 nbp hfg", (nb.vapour.hJkg - nb.liquid.hJkg)/1e3);
const nb2 = r134.saturationAtP(101325); console.log("134 nbp hfg", (nb2.vapour.hJkg - nb2.liquid.hJkg)/1e3, nb2.tDewK);
const nb3 = ze.saturationAtP(101325); console.log("ze nbp hfg", (nb3.vapour.hJkg - nb3.liquid.hJkg)/1e3);
// table vs full
for (const f of [co2, r134, ze, c3]) {
  let w = [0,0,0,0,0];
  for (let k = 0; k < 400; k++) {
    const t = f.range.tMinK + (f.meta.criticalTempK - 1 - f.range.tMinK) * (k + 0.37) / 400;
    const m = f.maxwellAtT(t); const s = f.saturationAtT(t);
    const l = f.raw(m.rhoL, t), v = f.raw(m.rhoV, t);
    w = [Math.max(w[0], Math.abs(s.pDewPa/m.pPa-1)), Math.max(w[1], Math.abs(s.liquid.densityKgM3/m.rhoL-1)), Math.max(w[2], Math.abs(s.vapour.densityKgM3/m.rhoV-1)), Math.max(w[3], Math.abs(s.vapour.hJkg - f.hOffsetJkg - v.hJkg), Math.abs(s.liquid.hJkg - f.hOffsetJkg - l.hJkg)), Math.max(w[4], Math.abs(s.vapour.sJkgK - f.sOffsetJkgK - v.sJkgK))];
  }
  console.log(f.meta.id, "table err", w);
}
