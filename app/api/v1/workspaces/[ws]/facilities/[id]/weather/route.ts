import { route, created } from "@/lib/api";
import { facilityParams } from "@/features/facilities/schema";
import { getFacilityRow } from "@/features/facilities/queries";
import { currentWeather, MAX_WEATHER_REQUEST_BYTES, storeMonthlyWeather, uploadWeather, weatherDto } from "@/features/energy/weather";
import { monthlyWeatherSchema } from "@/features/energy/monthly";
import { requestAnnualRun } from "@/features/energy/runs";
import { jobDto } from "@/features/jobs/queries";

/** The facility's weather year: its source, year, monthly means and how it was read (no hourly values). */
export const GET = route({
  params: facilityParams,
  action: "facility.read",
  handler: async ({ access, params }) => {
    await getFacilityRow(access!.workspace.id, params.id);
    const w = await currentWeather(access!.workspace.id, params.id);
    return { weather: w ? weatherDto(w) : null };
  },
});

/**
 * Uploads an hourly weather file (.csv or .epw, multipart field `file`, optional `year` for a
 * file of hours without dates). A file with any problem is refused with every row and column
 * named, and nothing is stored; a good one becomes the facility's weather and the year is run.
 */
export const POST = route({
  params: facilityParams,
  action: "model.edit",
  upload: { maxBytes: MAX_WEATHER_REQUEST_BYTES, what: "The weather file" },
  handler: async ({ access, user, params, req, upload }) => {
    const w = await uploadWeather(access!.workspace.id, params.id, user, req, upload!);
    const job = await requestAnnualRun({ workspaceId: access!.workspace.id, facilityId: params.id, userId: user.id, reason: "new weather year" });
    return created({ weather: weatherDto(w), job: job ? jobDto(access!.workspace.slug, job) : null });
  },
});

/**
 * Builds the facility's weather from monthly means (mean dry bulb, mean daily range, mean RH
 * for each month) by the annual engine's sine-day method: an approximation, labelled so.
 */
export const PUT = route({
  params: facilityParams,
  body: monthlyWeatherSchema,
  action: "model.edit",
  handler: async ({ access, user, params, body }) => {
    const w = await storeMonthlyWeather(access!.workspace.id, params.id, user, body);
    const job = await requestAnnualRun({ workspaceId: access!.workspace.id, facilityId: params.id, userId: user.id, reason: "new weather year" });
    return { weather: weatherDto(w), job: job ? jobDto(access!.workspace.slug, job) : null };
  },
});
