import "server-only";
import { and, desc, eq } from "drizzle-orm";
import { db } from "@/db/client";
import { weatherYears } from "@/db/schema";
import { AppError } from "@/lib/errors";
import { audit } from "@/lib/audit";
import { getFacilityRow } from "@/features/facilities/queries";
import { parseWeatherFile, summarizeWeather, WeatherFileError, MAX_WEATHER_BYTES } from "./weather-file";
import { weatherYearFieldSchema, type WeatherDto, type WeatherKind } from "./schema";
import { LoadInputError } from "@/lib/engine/loads";
import { sineDayYear } from "@/lib/engine/annual";
import { monthlyLabel, type MonthlyWeatherBody } from "./monthly";

/** Largest multipart request a weather upload accepts: the file's limit plus room for the form's other parts. */
export const MAX_WEATHER_REQUEST_BYTES = MAX_WEATHER_BYTES + 64 * 1024;

export type WeatherRow = typeof weatherYears.$inferSelect;
type Actor = { id: string; email: string };

export interface WeatherInput {
  kind: WeatherKind;
  label: string;
  year: number;
  startWeekday: number;
  dryBulbC: number[];
  rhPct: number[];
  pressurePa?: number | null;
  monthly?: Record<string, unknown> | null;
  fileName?: string | null;
  notes?: string[];
}

export function weatherDto(r: WeatherRow): WeatherDto {
  return {
    id: r.id,
    kind: r.kind as WeatherKind,
    label: r.label,
    year: r.year,
    startWeekday: r.startWeekday,
    hours: r.hours,
    pressurePa: r.pressurePa,
    fileName: r.fileName,
    notes: r.notes,
    monthly: r.monthly ?? null,
    createdAt: r.createdAt.toISOString(),
    summary: summarizeWeather(r),
  };
}

/** The facility's weather year (the newest stored), or null; scoped by workspace. */
export async function currentWeather(workspaceId: string, facilityId: string): Promise<WeatherRow | null> {
  const [r] = await db
    .select()
    .from(weatherYears)
    .where(and(eq(weatherYears.workspaceId, workspaceId), eq(weatherYears.facilityId, facilityId)))
    .orderBy(desc(weatherYears.createdAt))
    .limit(1);
  return r ?? null;
}

export async function weatherById(workspaceId: string, id: string): Promise<WeatherRow | null> {
  const [r] = await db.select().from(weatherYears).where(and(eq(weatherYears.workspaceId, workspaceId), eq(weatherYears.id, id))).limit(1);
  return r ?? null;
}

/** Stores a checked weather year as the facility's weather (one insert: all of it or nothing). */
export async function storeWeather(workspaceId: string, facilityId: string, user: Actor, w: WeatherInput): Promise<WeatherRow> {
  await getFacilityRow(workspaceId, facilityId); // not_found for another workspace's facility
  if (w.dryBulbC.length !== w.rhPct.length || (w.dryBulbC.length !== 8760 && w.dryBulbC.length !== 8784))
    throw new AppError("validation", `A weather year has 8760 or 8784 hours; this one has ${w.dryBulbC.length}.`, "weather");
  const [row] = await db
    .insert(weatherYears)
    .values({
      workspaceId,
      facilityId,
      kind: w.kind,
      label: w.label.slice(0, 300),
      year: w.year,
      startWeekday: w.startWeekday,
      hours: w.dryBulbC.length,
      dryBulbC: w.dryBulbC,
      rhPct: w.rhPct,
      pressurePa: w.pressurePa ?? null,
      monthly: w.monthly ?? null,
      fileName: w.fileName ?? null,
      notes: w.notes ?? [],
      createdBy: user.id,
    })
    .returning();
  await audit({ workspaceId, actorId: user.id, actorEmail: user.email, action: "weather.stored", targetType: "facility", targetId: facilityId, detail: { weatherId: row.id, kind: w.kind, label: row.label } });
  return row;
}

/**
 * A weather file from a multipart upload (field `file`, optional `year`) whose bytes route()
 * has read within MAX_WEATHER_REQUEST_BYTES. Every problem in the file is answered as a 400
 * naming its row and column, and nothing is stored.
 */
export async function uploadWeather(workspaceId: string, facilityId: string, user: Actor, req: Request, raw: Buffer): Promise<WeatherRow> {
  const facility = await getFacilityRow(workspaceId, facilityId);
  let form: FormData;
  try {
    form = await new Response(new Uint8Array(raw), { headers: { "content-type": req.headers.get("content-type") ?? "" } }).formData();
  } catch {
    throw new AppError("validation", "Send the weather file as multipart/form-data with a field named file.", "file");
  }
  const file = form.get("file");
  if (!(file instanceof File)) throw new AppError("validation", "Choose a weather file to upload (.csv or .epw).", "file");
  if ((file.name ?? "").includes("\0")) throw new AppError("validation", "file: the file name must not contain a NUL character", "file");
  const rawYear = form.get("year");
  let year: number | undefined;
  if (typeof rawYear === "string" && rawYear.trim() !== "") {
    const y = weatherYearFieldSchema.safeParse(rawYear);
    if (!y.success) throw new AppError("validation", y.error.issues[0].message, "year");
    year = y.data;
  }
  const fileName = (file.name || "weather.csv").slice(0, 200);
  let parsed;
  try {
    parsed = parseWeatherFile(new Uint8Array(await file.arrayBuffer()), fileName, { elevationM: facility.elevationM, year });
  } catch (e) {
    if (e instanceof WeatherFileError)
      throw new AppError(
        "validation",
        e.message,
        "file",
        e.problems.map((p) => ({ field: `row ${p.row} · ${p.column}`, message: p.message })),
      );
    throw e;
  }
  return storeWeather(workspaceId, facilityId, user, {
    kind: "file",
    label: parsed.source.label,
    year: parsed.year,
    startWeekday: parsed.startWeekday,
    dryBulbC: parsed.dryBulbC,
    rhPct: parsed.rhPct,
    pressurePa: parsed.pressurePa ?? null,
    fileName,
    notes: parsed.notes,
  });
}

/** A year built from monthly means by the engine's sine-day method, stored as the facility's weather. */
export async function storeMonthlyWeather(workspaceId: string, facilityId: string, user: Actor, body: MonthlyWeatherBody): Promise<WeatherRow> {
  await getFacilityRow(workspaceId, facilityId);
  let y;
  try {
    y = sineDayYear(body.climate, body.year);
  } catch (e) {
    if (e instanceof LoadInputError) throw new AppError("validation", e.message, e.field, e.issues.map((i) => ({ field: i.field, message: i.message })));
    throw e;
  }
  const label = monthlyLabel(body.climate.label, body.year);
  return storeWeather(workspaceId, facilityId, user, {
    kind: "monthly",
    label,
    year: y.year,
    startWeekday: y.startWeekday,
    dryBulbC: y.dryBulbC.map((v) => Math.round(v * 100) / 100),
    rhPct: y.rhPct.map((v) => Math.round(v * 100) / 100),
    pressurePa: y.pressurePa ?? null,
    monthly: { year: body.year, ...body.climate },
    notes: ["Every day of a month repeats the month's mean day: the dry bulb follows a cosine through the mean daily range (lowest at 03:00, highest at 15:00) with the month's moisture held constant. Day-to-day weather is not represented, so peaks are milder than in a real year."],
  });
}
