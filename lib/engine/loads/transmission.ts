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
/** The compass directions a wall can face. */
export const WALL_ORIENTATIONS = ["N", "NE", "E", "SE", "S", "SW", "W", "NW"] as const;
export type Orientation = (typeof WALL_ORIENTATIONS)[number];
type Cardinal = "N" | "E" | "S" | "W";

/**
 * Allowance for sun effect, K added to the outdoor dry bulb, by surface colour and facing
 * (ASHRAE Handbook—Refrigeration, "Refrigerated-facility loads" chapter, table "Allowance for
 * sun effect": east, south and west walls and flat roofs; north walls get none; from memory —
 * the same values are in the SI and I-P editions, °F 8/5/8/20 dark, 6/4/6/15 medium, 4/2/4/9
 * light). South is the equator-facing wall in the northern hemisphere.
 */
export const SOLAR_ALLOWANCE_K: Record<Colour, Record<Cardinal | "roof", number>> = {
  dark: { E: 5, S: 3, W: 5, N: 0, roof: 11 },
  medium: { E: 4, S: 3, W: 4, N: 0, roof: 9 },
  light: { E: 3, S: 2, W: 3, N: 0, roof: 5 },
};

/**
 * The intercardinal walls (NE, SE, SW, NW), which the handbook table does not list, take the
 * mean of their two cardinal neighbours (a Rimeplan rule, common practice: the daily solar
 * gain on a vertical wall varies smoothly with its azimuth, and the daily clear-sky totals of
 * the ASHRAE Fundamentals tables put NE/NW about midway between N and E/W and SE/SW close to
 * the mean of E/W and S). "roof" is a flat roof (or ceiling under it) open to the sky.
 */
export function solarAllowanceByFacing(colour: Colour, facing: Orientation | "roof"): number {
  const t = SOLAR_ALLOWANCE_K[colour];
  if (facing === "roof" || facing.length === 1) return t[facing as Cardinal | "roof"];
  const [a, b] = [facing[0] as Cardinal, facing[1] as Cardinal];
  return (t[a] + t[b]) / 2;
}

/** In the southern hemisphere the equator-facing side is the north: N and S swap in every facing. */
function towardsEquator(o: Orientation, hemisphere: "north" | "south"): Orientation {
  if (hemisphere === "north") return o;
  return o.replace(/[NS]/, (c) => (c === "N" ? "S" : "N")) as Orientation;
}

/**
 * The solar allowance for a sunlit surface: walls by orientation (N/S swapped in the southern
 * hemisphere, so the equator-facing wall gets the "south" value), roofs as flat roofs by
 * colour. Surfaces not facing outdoors, floors and walls without an orientation get none.
 */
export function solarAllowanceK(surface: SurfaceInput, hemisphere: "north" | "south"): number {
  if (surface.solarAllowanceK !== undefined) return surface.solarAllowanceK;
  if (surface.otherSide !== "outdoors") return 0;
  if (surface.kind === "roof" || surface.kind === "ceiling") return solarAllowanceByFacing(surface.colour, "roof");
  if (surface.kind !== "wall" || surface.orientation === undefined) return 0;
  return solarAllowanceByFacing(surface.colour, towardsEquator(surface.orientation, hemisphere));
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
