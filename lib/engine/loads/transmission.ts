import type { SurfaceInput } from "./schema";
import { fail } from "./errors";

/** Inside surface resistance for still air in a cold room, m²·K/W (common practice). */
export const INSIDE_FILM_M2KW = 0.12;
/** Outside surface resistance for an exposed wall or roof, m²·K/W (common practice). */
export const OUTSIDE_FILM_M2KW = 0.04;

export interface UValueResult {
  uValueWm2K: number;
  resistanceM2KW: number;
  method: string;
}

/**
 * Thermal transmittance of a construction, `U = 1 / (R_si + Σ L/λ + R_se)` W/(m²·K)
 * (series resistances, ASHRAE Handbook—Fundamentals heat-transfer chapter). A given U-value
 * is used as it is (it already includes the films).
 */
export function uValue(
  layers: ReadonlyArray<{ thicknessM: number; conductivityWmK: number }> | undefined,
  insideFilmM2KW: number,
  outsideFilmM2KW: number,
  givenUWm2K?: number,
): UValueResult {
  if (givenUWm2K !== undefined) return { uValueWm2K: givenUWm2K, resistanceM2KW: 1 / givenUWm2K, method: "given U-value" };
  let r = insideFilmM2KW + outsideFilmM2KW;
  for (const l of layers ?? []) r += l.thicknessM / l.conductivityWmK;
  if (!(r > 0)) fail("layers", "the construction has no thermal resistance");
  return { uValueWm2K: 1 / r, resistanceM2KW: r, method: "layers in series with surface films" };
}

type Colour = "light" | "medium" | "dark";
type Facing = "E" | "S" | "W" | "N" | "roof";

/**
 * Allowance for sun effect, K added to the outdoor dry bulb, by surface colour and facing
 * (ASHRAE Handbook—Refrigeration, refrigerated-facility loads chapter, "allowance for sun
 * effect" table, from memory). South is the equator-facing wall in the northern hemisphere.
 */
export const SOLAR_ALLOWANCE_K: Record<Colour, Record<Facing, number>> = {
  dark: { E: 5, S: 3, W: 5, N: 0, roof: 11 },
  medium: { E: 4, S: 3, W: 4, N: 0, roof: 9 },
  light: { E: 3, S: 2, W: 3, N: 0, roof: 5 },
};

/**
 * The solar allowance for a sunlit surface: walls by orientation (N/S swapped in the southern
 * hemisphere, so the equator-facing wall gets the "south" value), roofs as flat roofs.
 * Surfaces not facing outdoors, floors and walls without an orientation get none.
 */
export function solarAllowanceK(surface: SurfaceInput, hemisphere: "north" | "south"): number {
  if (surface.solarAllowanceK !== undefined) return surface.solarAllowanceK;
  if (surface.otherSide !== "outdoors") return 0;
  const table = SOLAR_ALLOWANCE_K[surface.colour];
  if (surface.kind === "roof" || surface.kind === "ceiling") return table.roof;
  if (surface.kind !== "wall" || surface.orientation === undefined) return 0;
  let o: Facing = surface.orientation;
  if (hemisphere === "south") o = o === "N" ? "S" : o === "S" ? "N" : o;
  return table[o];
}

/** Default outside film for what is on the other side. */
export function defaultOutsideFilm(surface: SurfaceInput): number {
  if (surface.otherSide === "outdoors") return OUTSIDE_FILM_M2KW;
  if (surface.otherSide === "ground" || surface.otherSide === "heatedSlab") return 0;
  return INSIDE_FILM_M2KW;
}

/** Surface area from the room dimensions when not given: walls length/width × height, others length × width. */
export function surfaceAreaM2(surface: SurfaceInput, room: { lengthM: number; widthM: number; heightM: number }, field: string): number {
  if (surface.areaM2 !== undefined) return surface.areaM2;
  if (surface.kind === "wall") {
    if (surface.along === "length") return room.lengthM * room.heightM;
    if (surface.along === "width") return room.widthM * room.heightM;
    fail(`${field}.along`, 'a wall needs areaM2 or along ("length" | "width")');
  }
  return room.lengthM * room.widthM;
}

/**
 * Heat gained through one surface, `q = U·A·(T_out − T_room)` W (ASHRAE Handbook—Refrigeration,
 * refrigerated-facility loads chapter). T_out includes the solar allowance for sunlit surfaces.
 */
export function transmissionW(uValueWm2K: number, areaM2: number, outsideTempC: number, roomTempC: number): number {
  return uValueWm2K * areaM2 * (outsideTempC - roomTempC);
}
