/** Design ambient of the site for condensers and the Carnot / Clausius sink. */
import type { Ambient } from "./circuit";

/** The site fields the plant reads (a subset of the ledger's site). */
export interface SiteForAmbient {
  designDryBulbC: number;
  coincidentWetBulbC?: number;
  designRH?: number;
}

/**
 * Wet-bulb temperature from dry bulb and RH by Stull's fit (R. Stull, "Wet-bulb temperature
 * from relative humidity and air temperature", J. Appl. Meteor. Climatol. 50, 2011), stated
 * within about ±1 K for RH 5–99 % and −20…50 °C at sea-level pressure; used only when the
 * site gives RH instead of the coincident wet bulb.
 */
export function stullWetBulbC(dryBulbC: number, rhPct: number): number {
  const t = dryBulbC;
  const rh = rhPct;
  return (
    t * Math.atan(0.151977 * Math.sqrt(rh + 8.313659)) +
    Math.atan(t + rh) -
    Math.atan(rh - 1.676331) +
    0.00391838 * Math.pow(rh, 1.5) * Math.atan(0.023101 * rh) -
    4.686035
  );
}

export function ambientOf(site: SiteForAmbient): Ambient {
  const wetBulbC = site.coincidentWetBulbC ?? stullWetBulbC(site.designDryBulbC, site.designRH ?? 50);
  return { dryBulbC: site.designDryBulbC, wetBulbC: Math.min(wetBulbC, site.designDryBulbC) };
}

