/**
 * Reads an hourly weather year from an upload: a plain CSV (a timestamp or an hour-of-year
 * column, dry bulb, and relative humidity or wet bulb or dew point; units in the header, read
 * as the importer reads them) or an EPW file (the open hourly weather format: eight header
 * lines, then one row per hour). Pure: no database, no side effects; every problem is named by
 * row and column, and a file with any problem gives no year at all.
 */
import { resolveColumns, readNumber, type FieldSpec, type ResolvedColumn } from "@/features/import/columns";
import { parseCsv } from "@/features/import/read-table";
import { rhPctFromDewPoint, rhPctFromWetBulb, sitePressurePa } from "@/lib/engine/loads";

/** Largest weather file accepted (an EPW year is about 1.6 MB). */
export const MAX_WEATHER_BYTES = 4 * 1024 * 1024;
/** Problems listed at most; the count says how many there were. */
const MAX_PROBLEMS = 100;

export const HOURS_PER_YEAR = 8760;
export const HOURS_PER_LEAP_YEAR = 8784;

/** Plausible outdoor air on Earth: below the lowest and above the highest ever recorded. */
export const WEATHER_RANGES = {
  dryBulbC: { min: -90, max: 60 },
  rhPct: { min: 0, max: 100 },
  pressurePa: { min: 30_000, max: 110_000 },
} as const;

export interface WeatherProblem {
  /** 1-based line of the file (the header is row 1 of a CSV; EPW data start at row 9). */
  row: number;
  column: string;
  message: string;
}

export class WeatherFileError extends Error {
  constructor(
    message: string,
    readonly problems: WeatherProblem[] = [],
    readonly problemCount = problems.length,
  ) {
    super(message);
    this.name = "WeatherFileError";
  }
}

/** A parsed weather year, in the shape the annual engine takes (its `WeatherYear`) plus what was read. */
export interface ParsedWeather {
  source: { kind: "file"; label: string };
  year: number;
  /** Weekday of 1 January, 0 = Monday. */
  startWeekday: number;
  dryBulbC: number[];
  rhPct: number[];
  pressurePa?: number;
  format: "csv" | "epw";
  /** How the file was read, in words (units assumed, the humidity column used, the year). */
  notes: string[];
}

export const isLeapYear = (y: number) => (y % 4 === 0 && y % 100 !== 0) || y % 400 === 0;
/** 0 = Monday … 6 = Sunday, for 1 January of a year (proleptic Gregorian). */
export const weekdayOfJan1 = (y: number) => (new Date(Date.UTC(y, 0, 1)).getUTCDay() + 6) % 7;
const WEEKDAYS = ["Monday", "Tuesday", "Wednesday", "Thursday", "Friday", "Saturday", "Sunday"];

/** The year a file without dates is read as: 2025 (1 January a Wednesday), or 2024 for 8784 hours. */
export const NOMINAL_YEAR = { normal: 2025, leap: 2024 } as const;

const round2 = (v: number) => Math.round(v * 100) / 100;

function decodeText(buf: Uint8Array, allowLatin1: boolean): string {
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(buf);
  } catch {
    // EPW headers (place names) are often written in a Windows code page.
    if (allowLatin1) return new TextDecoder("windows-1252").decode(buf);
    throw new WeatherFileError('The CSV is not UTF-8 text. Save it as "CSV UTF-8" and upload it again.');
  }
}

class Problems {
  list: WeatherProblem[] = [];
  count = 0;
  add(row: number, column: string, message: string) {
    this.count++;
    if (this.list.length < MAX_PROBLEMS) this.list.push({ row, column, message });
  }
  throwIfAny(what: string) {
    if (this.count === 0) return;
    const first = this.list[0];
    throw new WeatherFileError(
      `${this.count} problem${this.count === 1 ? "" : "s"} in ${what}; nothing was stored. The first: row ${first.row}, column "${first.column}": ${first.message}`,
      this.list,
      this.count,
    );
  }
}

/**
 * Reads a weather file. The format comes from the content (an EPW starts with `LOCATION,`),
 * checked against the name (.epw, .csv or .txt). `elevationM` gives the standard-atmosphere
 * pressure used to turn a wet bulb into relative humidity when the file has no pressure.
 */
export function parseWeatherFile(buf: Uint8Array, fileName: string, opts: { elevationM?: number; year?: number } = {}): ParsedWeather {
  if (buf.length === 0) throw new WeatherFileError("The file is empty.");
  if (buf.length > MAX_WEATHER_BYTES)
    throw new WeatherFileError(`The file is ${(buf.length / 1048576).toFixed(1)} MB; at most ${MAX_WEATHER_BYTES / 1048576} MB is accepted.`);
  if (buf.length >= 4 && buf[0] === 0x50 && buf[1] === 0x4b && buf[2] === 0x03 && buf[3] === 0x04)
    throw new WeatherFileError(`"${fileName}" is a ZIP archive (or a workbook). Unpack it, or save the sheet as CSV, and upload the .epw or .csv file itself.`);
  if (buf.includes(0)) throw new WeatherFileError("The file contains binary data (a zero byte); a weather file must be plain text.");
  const ext = (/\.([a-z0-9]+)$/i.exec(fileName)?.[1] ?? "").toLowerCase();
  const head = new TextDecoder("latin1").decode(buf.subarray(0, 16)).replace(/^\uFEFF|^ï»¿/, "");
  const looksEpw = /^LOCATION,/i.test(head);
  if (ext === "epw" || looksEpw) {
    if (!looksEpw) throw new WeatherFileError(`"${fileName}" is named .epw but does not start with the EPW "LOCATION," line.`);
    return parseEpw(decodeText(buf, true).replace(/^\uFEFF/, ""), fileName);
  }
  if (ext !== "csv" && ext !== "txt") throw new WeatherFileError(`"${fileName}" is neither .csv nor .epw. Upload an hourly CSV or an EPW weather file.`);
  return parseWeatherCsv(decodeText(buf, false).replace(/^\uFEFF/, ""), fileName, opts);
}

const CSV_FIELDS: FieldSpec[] = [
  { key: "time", names: ["timestamp", "time", "date", "datetime", "date time", "date/time"], quantity: "text", required: false },
  { key: "hour", names: ["hour", "hour of year", "hour of the year", "hoy", "hour number"], quantity: "text", required: false },
  { key: "dryBulbC", names: ["dry bulb", "dry-bulb", "drybulb", "dry bulb temperature", "dry-bulb temperature", "tdb", "air temperature", "temperature", "temp", "t"], quantity: "temp", required: true },
  { key: "rhPct", names: ["relative humidity", "rh", "humidity", "rel. humidity", "rel humidity"], quantity: "percent", required: false },
  { key: "wetBulbC", names: ["wet bulb", "wet-bulb", "wetbulb", "wet bulb temperature", "wet-bulb temperature", "twb"], quantity: "temp", required: false },
  { key: "dewPointC", names: ["dew point", "dew-point", "dewpoint", "dew point temperature", "dew-point temperature", "tdp"], quantity: "temp", required: false },
  { key: "pressurePa", names: ["pressure", "atmospheric pressure", "station pressure", "barometric pressure", "p"], quantity: "pressure", required: false },
];

const TIMESTAMP = /^(\d{4})-(\d{2})-(\d{2})(?:[T ](\d{2}):(\d{2})(?::(\d{2}))?(?:\.\d+)?)?\s*(Z|[+-]\d{2}:?\d{2})?$/;

/** Milliseconds since the epoch of a naive ISO 8601 timestamp read as clock time (no zone applied), or null. */
function readTimestamp(v: string): { ms: number; year: number } | null {
  const m = TIMESTAMP.exec(v.trim());
  if (!m) return null;
  const [y, mo, d, h = "0", mi = "0", s = "0"] = m.slice(1, 7);
  const ms = Date.UTC(+y, +mo - 1, +d, +h, +mi, +s);
  const back = new Date(ms);
  // Refuses 31 February, hour 24 and the like (Date would roll them over silently).
  if (back.getUTCFullYear() !== +y || back.getUTCMonth() !== +mo - 1 || back.getUTCDate() !== +d || back.getUTCHours() !== +h || back.getUTCMinutes() !== +mi) return null;
  return { ms, year: +y };
}

const HOUR_MS = 3_600_000;
function describe(ms: number): string {
  return new Date(ms).toISOString().slice(0, 16).replace("T", " ");
}

function countProblem(n: number, where: string): string {
  return `${where} ${n} hourly row${n === 1 ? "" : "s"}; a weather year has ${HOURS_PER_YEAR} (or ${HOURS_PER_LEAP_YEAR} in a leap year), one for every hour.`;
}

/** The plain CSV form. */
export function parseWeatherCsv(text: string, fileName: string, opts: { elevationM?: number; year?: number } = {}): ParsedWeather {
  const records = parseCsvOrThrow(text);
  const [headRaw, ...data] = records;
  const headers = (headRaw ?? []).map((h) => h.trim());
  if (headers.length === 0 || headers.every((h) => h === "")) throw new WeatherFileError("The first row must hold the column headers; it is empty.");
  const { columns, problems: headerProblems } = resolveColumns(headers, CSV_FIELDS);
  const col = (key: string): ResolvedColumn | undefined => columns.find((c) => c.spec.key === key);
  const probs = new Problems();
  for (const p of headerProblems) probs.add(1, p.column, p.message);
  const time = col("time");
  const hour = col("hour");
  if (!time && !hour) probs.add(1, "timestamp", 'a time column is required: "Timestamp" (ISO 8601, e.g. 2025-01-01 00:00) or "Hour" (hour of the year, 1 to 8760)');
  const humidity = col("rhPct") ?? col("dewPointC") ?? col("wetBulbC");
  if (!humidity) probs.add(1, "relative humidity", 'a humidity column is required: "Relative humidity [%]", "Wet bulb [°C]" or "Dew point [°C]"');
  probs.throwIfAny(`the header of ${fileName}`);

  const notes: string[] = columns.filter((c) => c.note).map((c) => c.note!);
  const others = ["rhPct", "dewPointC", "wetBulbC"].filter((k) => k !== humidity!.spec.key && col(k));
  if (others.length) notes.push(`Humidity read from "${humidity!.header}"; ${others.map((k) => `"${col(k)!.header}"`).join(" and ")} not used.`);
  const rows = data.map((cells, i) => ({ row: i + 2, cells })).filter((r) => r.cells.some((c) => c.trim() !== ""));
  if (rows.length === 0) throw new WeatherFileError("The file has headers but no data rows.");
  if (rows.length > HOURS_PER_LEAP_YEAR + 24)
    throw new WeatherFileError(countProblem(rows.length, "The file has") + ` Row ${rows[HOURS_PER_LEAP_YEAR + 1].row} and later are more than a year.`, [
      { row: rows[HOURS_PER_LEAP_YEAR].row, column: (time ?? hour)!.header, message: `more than ${HOURS_PER_LEAP_YEAR} hours` },
    ]);

  const pressureCol = col("pressurePa");
  const defaultPressurePa = sitePressurePa(opts.elevationM ?? 0);
  const dry: number[] = [];
  const rh: number[] = [];
  const pressures: number[] = [];
  let firstMs: number | null = null;
  let prevMs: number | null = null;
  let hourEnding = false;
  let fileYear: number | null = null;
  let prevHour: number | null = null;

  const num = (r: { row: number; cells: string[] }, c: ResolvedColumn): number | null => {
    const raw = r.cells[c.index];
    const n = readNumber(raw === undefined || raw.trim() === "" ? null : raw);
    if (!n.ok) {
      probs.add(r.row, c.header, n.message === "is empty" ? "is empty: every hour needs a value (a gap in the data)" : n.message);
      return null;
    }
    return c.unit!.toSI(n.value);
  };

  for (const r of rows) {
    if (time) {
      const raw = (r.cells[time.index] ?? "").trim();
      const t = readTimestamp(raw);
      if (!t) probs.add(r.row, time.header, raw === "" ? "is empty: every hour needs its timestamp" : `"${raw}" is not an ISO 8601 date and time (write 2025-03-14 06:00)`);
      else {
        if (firstMs === null) {
          firstMs = t.ms;
          const d = new Date(t.ms);
          const jan1 = Date.UTC(d.getUTCFullYear(), 0, 1);
          if (t.ms === jan1) fileYear = t.year;
          else if (t.ms === jan1 + HOUR_MS) {
            fileYear = t.year;
            hourEnding = true;
            notes.push("Timestamps start at 01:00 on 1 January: each row is read as the hour ending at its time.");
          } else probs.add(r.row, time.header, `the year must start at 1 January 00:00 (or 01:00 for hour-ending data); this file starts at ${describe(t.ms)}`);
        } else if (prevMs !== null && t.ms !== prevMs + HOUR_MS) {
          const msg =
            t.ms > prevMs + HOUR_MS
              ? `${describe(t.ms)} follows ${describe(prevMs)}: ${Math.round((t.ms - prevMs) / HOUR_MS) - 1} hour(s) missing (a gap); every hour of the year must be there`
              : `${describe(t.ms)} follows ${describe(prevMs)}: rows must be one hour apart, in order, without repeats`;
          probs.add(r.row, time.header, msg);
        }
        prevMs = t.ms;
      }
    } else if (hour) {
      const raw = (r.cells[hour.index] ?? "").trim();
      const n = readNumber(raw === "" ? null : raw);
      if (!n.ok || !Number.isInteger(n.value)) probs.add(r.row, hour.header, !n.ok ? n.message : `"${raw}" is not a whole hour number`);
      else {
        if (prevHour === null) {
          if (n.value !== 0 && n.value !== 1) probs.add(r.row, hour.header, `the first hour must be 1 (or 0); it is ${n.value}`);
        } else if (n.value !== prevHour + 1)
          probs.add(r.row, hour.header, n.value > prevHour + 1 ? `hour ${n.value} follows hour ${prevHour}: ${n.value - prevHour - 1} hour(s) missing (a gap)` : `hour ${n.value} follows hour ${prevHour}: hours must count up by one`);
        prevHour = n.value;
      }
    }
    const t = num(r, col("dryBulbC")!);
    if (t !== null && !(t >= WEATHER_RANGES.dryBulbC.min && t <= WEATHER_RANGES.dryBulbC.max))
      probs.add(r.row, col("dryBulbC")!.header, `${round2(t)} °C is outside ${WEATHER_RANGES.dryBulbC.min} to ${WEATHER_RANGES.dryBulbC.max} °C`);
    let p = defaultPressurePa;
    if (pressureCol) {
      const v = num(r, pressureCol);
      if (v !== null) {
        if (!(v >= WEATHER_RANGES.pressurePa.min && v <= WEATHER_RANGES.pressurePa.max))
          probs.add(r.row, pressureCol.header, `${Math.round(v)} Pa is outside ${WEATHER_RANGES.pressurePa.min} to ${WEATHER_RANGES.pressurePa.max} Pa`);
        else {
          p = v;
          pressures.push(v);
        }
      }
    }
    const h = num(r, humidity!);
    let rhPct: number | null = null;
    if (h !== null && t !== null) rhPct = humidityToRh(humidity!.spec.key, t, h, p, r.row, humidity!.header, probs);
    dry.push(t ?? NaN);
    rh.push(rhPct ?? NaN);
  }
  const n = rows.length;
  if (n !== HOURS_PER_YEAR && n !== HOURS_PER_LEAP_YEAR) {
    const last = rows[n - 1];
    probs.add(last.row, (time ?? hour)!.header, countProblem(n, `the file ends at row ${last.row} after`));
  }
  let year: number;
  if (time) {
    year = fileYear ?? NOMINAL_YEAR.normal;
    if (fileYear !== null && probs.count === 0 && (n === HOURS_PER_LEAP_YEAR) !== isLeapYear(fileYear))
      probs.add(rows[n - 1].row, time.header, `${fileYear} has ${isLeapYear(fileYear) ? HOURS_PER_LEAP_YEAR : HOURS_PER_YEAR} hours; the file has ${n}`);
  } else {
    year = opts.year ?? (n === HOURS_PER_LEAP_YEAR ? NOMINAL_YEAR.leap : NOMINAL_YEAR.normal);
    if ((n === HOURS_PER_LEAP_YEAR) !== isLeapYear(year) && (n === HOURS_PER_YEAR || n === HOURS_PER_LEAP_YEAR))
      probs.add(1, hour!.header, `${year} has ${isLeapYear(year) ? HOURS_PER_LEAP_YEAR : HOURS_PER_YEAR} hours; the file has ${n}`);
    else notes.push(`The file has hours, not dates: read as the year ${year} (1 January a ${WEEKDAYS[weekdayOfJan1(year)]}), which sets the weekday schedules.`);
  }
  probs.throwIfAny(fileName);
  void hourEnding;
  const pressurePa = pressures.length ? Math.round(pressures.reduce((a, b) => a + b, 0) / pressures.length) : undefined;
  if (!pressureCol && humidity!.spec.key === "wetBulbC") notes.push(`Wet bulb turned into relative humidity at ${Math.round(defaultPressurePa)} Pa (the standard atmosphere at the site's elevation).`);
  return {
    source: { kind: "file", label: `${fileName} (hourly CSV, ${year})` },
    year,
    startWeekday: weekdayOfJan1(year),
    dryBulbC: dry.map(round2),
    rhPct: rh.map(round2),
    ...(pressurePa !== undefined ? { pressurePa } : {}),
    format: "csv",
    notes,
  };
}

function parseCsvOrThrow(text: string): string[][] {
  try {
    return parseCsv(text);
  } catch (e) {
    throw new WeatherFileError((e as Error).message);
  }
}

/** Relative humidity from the humidity column's quantity; a value out of range is a problem on its row. */
function humidityToRh(key: string, tempC: number, v: number, pressurePa: number, row: number, header: string, probs: Problems): number | null {
  if (key === "rhPct") {
    if (!(v >= 0 && v <= 100)) {
      probs.add(row, header, `${round2(v)} % is ${v > 100 ? "over 100 %" : "below 0 %"}; relative humidity must be between 0 and 100 %`);
      return null;
    }
    return v;
  }
  if (v > tempC + 0.05) {
    probs.add(row, header, `${round2(v)} °C is above the dry bulb ${round2(tempC)} °C; a ${key === "wetBulbC" ? "wet bulb" : "dew point"} cannot exceed it`);
    return null;
  }
  const t2 = Math.min(v, tempC);
  const r = key === "wetBulbC" ? rhPctFromWetBulb(tempC, t2, pressurePa) : rhPctFromDewPoint(tempC, t2);
  if (!(r >= 0)) {
    probs.add(row, header, `${round2(v)} °C is too low for the dry bulb ${round2(tempC)} °C (the air would hold less than no water)`);
    return null;
  }
  return Math.min(100, r);
}

/** EPW missing-value markers (EnergyPlus weather file format): dry bulb and dew point 99.9, RH 999, pressure 999999. */
const EPW_MISSING = { dryBulb: 99.9, dewPoint: 99.9, rh: 999, pressure: 999999 };
const EPW_COLUMNS = { year: 0, month: 1, day: 2, hour: 3, dryBulb: 6, dewPoint: 7, rh: 8, pressure: 9 } as const;
const EPW_NAMES: Record<keyof typeof EPW_COLUMNS, string> = {
  year: "Year (field 1)",
  month: "Month (field 2)",
  day: "Day (field 3)",
  hour: "Hour (field 4)",
  dryBulb: "Dry bulb °C (field 7)",
  dewPoint: "Dew point °C (field 8)",
  rh: "Relative humidity % (field 9)",
  pressure: "Pressure Pa (field 10)",
};
const DAYS_IN_MONTH = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

/**
 * The EPW form (EnergyPlus weather file, as published with the EnergyPlus "Auxiliary
 * Programs" documentation): lines 1–8 are headers (LOCATION … DATA PERIODS), then one line per
 * hour with year, month, day, hour 1–24, minute, source flags, dry bulb °C, dew point °C,
 * relative humidity %, station pressure Pa, …. Relative humidity is taken as written; where it
 * is missing (999) it is computed from the dew point.
 */
export function parseEpw(text: string, fileName: string): ParsedWeather {
  const lines = text.split(/\r?\n/);
  while (lines.length && lines[lines.length - 1].trim() === "") lines.pop();
  const location = lines[0]?.split(",") ?? [];
  if (lines.length < 9 || !/^DATA PERIODS/i.test(lines[7] ?? ""))
    throw new WeatherFileError(`"${fileName}" does not have the eight EPW header lines (LOCATION … DATA PERIODS) before the hourly data.`, [{ row: 8, column: "(header)", message: 'line 8 must be "DATA PERIODS,…"' }]);
  const periods = lines[7].split(",").map((s) => s.trim());
  const weekdayName = periods[4] ?? "";
  const wd = WEEKDAYS.findIndex((w) => w.toLowerCase() === weekdayName.toLowerCase());
  const probs = new Problems();
  const data = lines.slice(8);
  const n = data.length;
  if (n > HOURS_PER_LEAP_YEAR + 24) throw new WeatherFileError(countProblem(n, "The file has"), [{ row: 9 + HOURS_PER_LEAP_YEAR, column: EPW_NAMES.hour, message: `more than ${HOURS_PER_LEAP_YEAR} hours` }]);
  const leap = n === HOURS_PER_LEAP_YEAR;
  const dry: number[] = [];
  const rh: number[] = [];
  const pressures: number[] = [];
  const years = new Map<number, number>();
  let month = 1;
  let day = 1;
  let hour = 1;
  const field = (cells: string[], row: number, k: keyof typeof EPW_COLUMNS): number | null => {
    const raw = cells[EPW_COLUMNS[k]];
    const v = readNumber(raw === undefined || raw.trim() === "" ? null : raw);
    if (!v.ok) {
      probs.add(row, EPW_NAMES[k], v.message === "is empty" ? "is empty (a gap in the data)" : v.message);
      return null;
    }
    return v.value;
  };
  for (let i = 0; i < n; i++) {
    const row = i + 9;
    const cells = data[i].split(",");
    if (cells.length < 10) {
      probs.add(row, EPW_NAMES.pressure, `the line has ${cells.length} fields; an EPW data line has 35 (at least the first 10 are read)`);
      dry.push(NaN);
      rh.push(NaN);
      continue;
    }
    const y = field(cells, row, "year");
    const mo = field(cells, row, "month");
    const d = field(cells, row, "day");
    const h = field(cells, row, "hour");
    if (y !== null) years.set(y, (years.get(y) ?? 0) + 1);
    if (mo !== null && d !== null && h !== null && (mo !== month || d !== day || h !== hour))
      probs.add(row, EPW_NAMES.hour, `expected ${day} ${MONTHS[month - 1]} hour ${hour}, found ${d} ${MONTHS[mo - 1] ?? `month ${mo}`} hour ${h}: a gap or a repeated hour`);
    // the expected next hour, on the calendar the row count implies
    hour++;
    if (hour > 24) {
      hour = 1;
      day++;
      if (day > DAYS_IN_MONTH[month - 1] + (leap && month === 2 ? 1 : 0)) {
        day = 1;
        month++;
      }
    }
    const t = field(cells, row, "dryBulb");
    const dp = field(cells, row, "dewPoint");
    const r = field(cells, row, "rh");
    const p = field(cells, row, "pressure");
    if (t !== null && t === EPW_MISSING.dryBulb) probs.add(row, EPW_NAMES.dryBulb, "is marked missing (99.9): a gap in the data");
    else if (t !== null && !(t >= WEATHER_RANGES.dryBulbC.min && t <= WEATHER_RANGES.dryBulbC.max))
      probs.add(row, EPW_NAMES.dryBulb, `${t} °C is outside ${WEATHER_RANGES.dryBulbC.min} to ${WEATHER_RANGES.dryBulbC.max} °C`);
    if (p !== null && p !== EPW_MISSING.pressure) {
      if (!(p >= WEATHER_RANGES.pressurePa.min && p <= WEATHER_RANGES.pressurePa.max))
        probs.add(row, EPW_NAMES.pressure, `${p} Pa is outside ${WEATHER_RANGES.pressurePa.min} to ${WEATHER_RANGES.pressurePa.max} Pa`);
      else pressures.push(p);
    }
    let value: number | null = null;
    if (r !== null && r !== EPW_MISSING.rh) {
      if (!(r >= 0 && r <= 100)) probs.add(row, EPW_NAMES.rh, `${r} % is ${r > 100 ? "over 100 %" : "below 0 %"}; relative humidity must be between 0 and 100 %`);
      else value = r;
    } else if (r === EPW_MISSING.rh) {
      if (dp === null || dp === EPW_MISSING.dewPoint) probs.add(row, EPW_NAMES.rh, "relative humidity and dew point are both marked missing: a gap in the data");
      else if (t !== null && t !== EPW_MISSING.dryBulb) value = humidityToRh("dewPointC", t, dp, 101_325, row, EPW_NAMES.dewPoint, probs);
    }
    dry.push(t ?? NaN);
    rh.push(value ?? NaN);
  }
  if (n !== HOURS_PER_YEAR && n !== HOURS_PER_LEAP_YEAR) probs.add(8 + n, EPW_NAMES.hour, countProblem(n, `the file ends at row ${8 + n} after`));
  probs.throwIfAny(fileName);
  const notes: string[] = [];
  const [commonYear] = [...years.entries()].sort((a, b) => b[1] - a[1])[0] ?? [NOMINAL_YEAR.normal];
  let year = commonYear;
  const typical = years.size > 1;
  if (typical || isLeapYear(year) !== leap) {
    year = leap ? NOMINAL_YEAR.leap : NOMINAL_YEAR.normal;
    notes.push(`The months come from ${years.size > 1 ? `${years.size} different years (a typical year)` : `the year ${commonYear}, whose length differs from the file's`}: read as the year ${year}.`);
  }
  const startWeekday = wd >= 0 ? wd : weekdayOfJan1(year);
  notes.push(wd >= 0 ? `1 January is a ${WEEKDAYS[wd]}, as the file's DATA PERIODS line says.` : `1 January is a ${WEEKDAYS[startWeekday]} (${year}).`);
  const place = [location[1], location[2], location[3]].map((s) => (s ?? "").trim()).filter((s) => s && s !== "-").join(", ");
  const pressurePa = pressures.length ? Math.round(pressures.reduce((a, b) => a + b, 0) / pressures.length) : undefined;
  return {
    source: { kind: "file", label: `${fileName} (EPW${place ? `, ${place}` : ""}${typical ? ", typical year" : `, ${year}`})` },
    year,
    startWeekday,
    dryBulbC: dry.map(round2),
    rhPct: rh.map(round2),
    ...(pressurePa !== undefined ? { pressurePa } : {}),
    format: "epw",
    notes,
  };
}

const MONTHS = ["Jan", "Feb", "Mar", "Apr", "May", "Jun", "Jul", "Aug", "Sep", "Oct", "Nov", "Dec"];

/** Monthly means and extremes of a year, for showing what was read. */
export interface WeatherSummary {
  hours: number;
  months: { month: number; meanDryBulbC: number; minDryBulbC: number; maxDryBulbC: number; meanRhPct: number }[];
  meanDryBulbC: number;
  minDryBulbC: number;
  maxDryBulbC: number;
  /** 0-based hour of the year of the warmest hour. */
  maxHour: number;
}

export function summarizeWeather(w: { year: number; dryBulbC: number[]; rhPct: number[] }): WeatherSummary {
  const leap = w.dryBulbC.length === HOURS_PER_LEAP_YEAR;
  const months: WeatherSummary["months"] = [];
  let h = 0;
  for (let m = 0; m < 12; m++) {
    const hours = (DAYS_IN_MONTH[m] + (leap && m === 1 ? 1 : 0)) * 24;
    const t = w.dryBulbC.slice(h, h + hours);
    const r = w.rhPct.slice(h, h + hours);
    months.push({
      month: m + 1,
      meanDryBulbC: round2(t.reduce((a, b) => a + b, 0) / t.length),
      minDryBulbC: Math.min(...t),
      maxDryBulbC: Math.max(...t),
      meanRhPct: round2(r.reduce((a, b) => a + b, 0) / r.length),
    });
    h += hours;
  }
  let maxHour = 0;
  for (let i = 1; i < w.dryBulbC.length; i++) if (w.dryBulbC[i] > w.dryBulbC[maxHour]) maxHour = i;
  return {
    hours: w.dryBulbC.length,
    months,
    meanDryBulbC: round2(w.dryBulbC.reduce((a, b) => a + b, 0) / w.dryBulbC.length),
    minDryBulbC: Math.min(...w.dryBulbC),
    maxDryBulbC: w.dryBulbC[maxHour],
    maxHour,
  };
}
