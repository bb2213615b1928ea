import { z } from "zod";
import type { WeatherSummary } from "./weather-file";

/** ISO 4217 codes the runtime knows (Intl), e.g. EUR, USD, GBP. */
const KNOWN_CURRENCIES = new Set(typeof Intl.supportedValuesOf === "function" ? Intl.supportedValuesOf("currency") : ["EUR", "USD", "GBP"]);

export const currencySchema = z
  .string({ error: "currency must be an ISO 4217 code of three letters, e.g. EUR, USD or GBP" })
  .trim()
  .toUpperCase()
  .refine((c) => /^[A-Z]{3}$/.test(c) && KNOWN_CURRENCIES.has(c), "currency must be an ISO 4217 code of three letters, e.g. EUR, USD or GBP");

export const workspaceSettingsSchema = z.object({ currency: currencySchema });
export type WorkspaceSettings = z.infer<typeof workspaceSettingsSchema>;

/** Currencies offered first in the form (any ISO 4217 code is accepted). */
export const COMMON_CURRENCIES = ["EUR", "USD", "GBP", "CHF", "SEK", "NOK", "DKK", "PLN", "CZK", "CAD", "AUD", "NZD", "JPY", "CNY", "INR", "BRL", "ZAR"] as const;

/** The optional "year" form field of a weather upload (for files that give hours, not dates). */
export const weatherYearFieldSchema = z.coerce
  .number({ error: "year must be a whole number from 1900 to 2100" })
  .int("year must be a whole number from 1900 to 2100")
  .min(1900, "year must be a whole number from 1900 to 2100")
  .max(2100, "year must be a whole number from 1900 to 2100");

export type WeatherKind = "file" | "monthly" | "demo";

/** What the API answers about a facility's weather year (the hourly values stay on the server). */
export interface WeatherDto {
  id: string;
  kind: WeatherKind;
  label: string;
  year: number;
  startWeekday: number;
  hours: number;
  pressurePa: number | null;
  fileName: string | null;
  notes: string[];
  monthly: Record<string, unknown> | null;
  createdAt: string;
  summary: WeatherSummary;
}

export const SOURCE_WORDS: Record<WeatherKind, string> = {
  file: "uploaded hourly file",
  monthly: "built from monthly means (an approximation)",
  demo: "invented demo year (fictional)",
};

/** A year to build from monthly means: the year (sets the calendar and weekdays) and the twelve months. */
export const YEAR_MSG = "year must be a whole number from 1900 to 2100";
export const monthlyYearNumber = z.number({ error: YEAR_MSG }).int(YEAR_MSG).min(1900, YEAR_MSG).max(2100, YEAR_MSG);
