import { z } from "zod";
import { monthlyClimateSchema } from "@/lib/engine/annual";
import { monthlyYearNumber } from "./schema";

/** Body of the monthly-means form: the year and the engine's monthly climate (twelve of each, ranges named). */
export const monthlyWeatherSchema = z.object({ year: monthlyYearNumber, climate: monthlyClimateSchema });
export type MonthlyWeatherBody = z.infer<typeof monthlyWeatherSchema>;

/** The label a year built from monthly means carries wherever it is shown. */
export function monthlyLabel(name: string, year: number): string {
  return `${name} — sine-day year ${year} from monthly means (an approximation)`;
}
