import { describe, expect, it } from "vitest";
import { HARROWFIELD_CLIMATE, inventYear, yearToCsv } from "@/seeds/invented-weather";
import { parseWeatherFile, summarizeWeather, WeatherFileError, weekdayOfJan1 } from "./weather-file";

const enc = (s: string) => new TextEncoder().encode(s);
const invented = yearToCsv(inventYear(HARROWFIELD_CLIMATE, { year: 2025, seed: 7 }));
const lines = invented.trimEnd().split("\n");

function refusal(text: string | Uint8Array, name = "w.csv"): WeatherFileError {
  try {
    parseWeatherFile(typeof text === "string" ? enc(text) : text, name);
  } catch (e) {
    expect(e).toBeInstanceOf(WeatherFileError);
    return e as WeatherFileError;
  }
  throw new Error("the file was accepted");
}

/** An hour-of-year CSV with a constant hour and the given humidity column. */
function hourly(n: number, header: string, row: (h: number) => string): string {
  return [header, ...Array.from({ length: n }, (_, i) => `${i + 1},${row(i + 1)}`)].join("\n");
}

/** A small EPW in the published layout: 8 header lines, then 35 fields per hour (an invented place). */
function epw(n = 8760, tweak?: (cells: string[], i: number) => void): string {
  const head = [
    "LOCATION,Nowhere Flats,Invented,XX,Invented data,000000,51.00,-1.00,0.0,150.0",
    "DESIGN CONDITIONS,0",
    "TYPICAL/EXTREME PERIODS,0",
    "GROUND TEMPERATURES,0",
    "HOLIDAYS/DAYLIGHT SAVINGS,No,0,0,0",
    "COMMENTS 1,invented for a test",
    "COMMENTS 2,",
    "DATA PERIODS,1,1,Data,Tuesday, 1/ 1,12/31",
  ];
  const days = [31, 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];
  const rows: string[] = [];
  let i = 0;
  for (let m = 0; m < 12 && i < n; m++)
    for (let d = 1; d <= days[m] && i < n; d++)
      for (let h = 1; h <= 24 && i < n; h++, i++) {
        const cells = [String(m < 6 ? 1999 : 2003), String(m + 1), String(d), String(h), "60", "?9?9?9?9E0?9?9?9", "20.0", "10.0", "52", "99000"];
        while (cells.length < 35) cells.push("0");
        tweak?.(cells, i);
        rows.push(cells.join(","));
      }
  return [...head, ...rows].join("\r\n") + "\r\n";
}

describe("plain CSV weather files", () => {
  it("reads an invented year with timestamps: 8760 hours, the year and the weekday of 1 January from the dates", () => {
    const w = parseWeatherFile(enc(invented), "invented.csv");
    expect(w.format).toBe("csv");
    expect(w.dryBulbC).toHaveLength(8760);
    expect(w.rhPct).toHaveLength(8760);
    expect(w.year).toBe(2025);
    // 1 January 2025 was a Wednesday (any calendar); 0 = Monday
    expect(w.startWeekday).toBe(2);
    expect(w.source).toEqual({ kind: "file", label: "invented.csv (hourly CSV, 2025)" });
    expect(w.dryBulbC[5]).toBe(Number(lines[6].split(",")[1]));
    expect(w.rhPct.every((r) => r >= 0 && r <= 100)).toBe(true);
  });

  it("weekday of 1 January: 2024 Monday, 2025 Wednesday, 2000 Saturday (any calendar)", () => {
    expect([weekdayOfJan1(2024), weekdayOfJan1(2025), weekdayOfJan1(2000)]).toEqual([0, 2, 5]);
  });

  it("turns a dew point into relative humidity: 20 °C with a 10 °C dew point is 52.5 %", () => {
    // ASHRAE Handbook—Fundamentals (2017) ch. 1 table 3: p_ws(10 °C) = 1.2282 kPa, p_ws(20 °C) = 2.3392 kPa → 52.50 %
    const w = parseWeatherFile(enc(hourly(8760, "Hour,Dry bulb [°C],Dew point [°C]", () => "20,10")), "dp.csv");
    expect(w.rhPct[0]).toBeCloseTo(52.5, 1);
    expect(w.year).toBe(2025);
    expect(w.notes.join(" ")).toMatch(/hours, not dates: read as the year 2025/);
  });

  it("turns a wet bulb into relative humidity: 25 °C dry bulb, 18 °C wet bulb at 101 325 Pa is 50.7 %", () => {
    // Hand calculation with ASHRAE Handbook—Fundamentals (2017) ch. 1 eqs. 22, 35 and table 3:
    // W*s(18 °C) = 0.01293, W = (2459.1·0.01293 − 1.006·7)/2471.1 = 0.01002, p_w = 1606 Pa, p_ws(25 °C) = 3169.9 Pa → 50.7 %
    const w = parseWeatherFile(enc(hourly(8760, "Hour,Temperature [°C],Wet bulb [°C],Pressure [Pa]", () => "25,18,101325")), "wb.csv");
    expect(w.rhPct[100]).toBeCloseTo(50.7, 0);
    expect(w.pressurePa).toBe(101325);
  });

  it("reads °F and hPa from the header, as the importer does", () => {
    const w = parseWeatherFile(enc(hourly(8760, "Hour;Dry bulb (°F);RH [%];Pressure [hPa]", () => "50;60;1000").replace(/,/g, ";")), "f.csv");
    expect(w.dryBulbC[0]).toBeCloseTo(10, 6);
    expect(w.pressurePa).toBe(100000);
  });

  it("an hour-of-year file with 8784 rows is a leap year (2024 unless a year is given)", () => {
    const w = parseWeatherFile(enc(hourly(8784, "Hour,Dry bulb [°C],RH [%]", () => "5,80")), "leap.csv");
    expect(w.year).toBe(2024);
    expect(w.startWeekday).toBe(0);
    expect(w.dryBulbC).toHaveLength(8784);
  });

  it("refuses a gap, naming the row and the column", () => {
    const gap = [...lines.slice(0, 500), ...lines.slice(501)].join("\n");
    const e = refusal(gap);
    expect(e.message).toMatch(/nothing was stored/);
    const p = e.problems.find((x) => /missing \(a gap\)/.test(x.message))!;
    expect(p.row).toBe(501);
    expect(p.column).toBe("Timestamp");
    expect(p.message).toContain("2025-01-21 20:00 follows 2025-01-21 18:00");
  });

  it("refuses a gap in an hour-of-year file and an empty cell as a gap", () => {
    const rows = hourly(8760, "Hour,Dry bulb [°C],RH [%]", () => "5,80").split("\n");
    rows.splice(1001, 1);
    expect(refusal(rows.join("\n")).problems[0]).toMatchObject({ row: 1002, column: "Hour", message: "hour 1002 follows hour 1000: 1 hour(s) missing (a gap)" });
    const blank = hourly(8760, "Hour,Dry bulb [°C],RH [%]", (h) => (h === 42 ? ",80" : "5,80"));
    expect(refusal(blank).problems[0]).toMatchObject({ row: 43, column: "Dry bulb [°C]", message: expect.stringContaining("a gap") });
  });

  it("refuses text in a number, naming the row and the column", () => {
    const bad = lines.map((l, i) => (i === 100 ? l.replace(/,[^,]+,/, ",warm,") : l)).join("\n");
    const e = refusal(bad);
    expect(e.problems).toEqual([{ row: 101, column: "Dry bulb [°C]", message: '"warm" is not a number' }]);
    expect(e.message).toContain('row 101, column "Dry bulb [°C]"');
  });

  it("refuses a relative humidity over 100 %, naming the row and the column", () => {
    const bad = lines.map((l, i) => (i === 2000 ? l.replace(/,[^,]+$/, ",104.5") : l)).join("\n");
    const e = refusal(bad);
    expect(e.problems).toEqual([{ row: 2001, column: "Relative humidity [%]", message: "104.5 % is over 100 %; relative humidity must be between 0 and 100 %" }]);
  });

  it("refuses a year of 8000 rows, naming the last row and the time column", () => {
    const e = refusal(lines.slice(0, 8001).join("\n"));
    expect(e.problems).toHaveLength(1);
    expect(e.problems[0].row).toBe(8001);
    expect(e.problems[0].column).toBe("Timestamp");
    expect(e.problems[0].message).toMatch(/8000 hourly rows; a weather year has 8760 \(or 8784 in a leap year\)/);
  });

  it("refuses a wet bulb above the dry bulb, a dew point too high, and a dry bulb out of range", () => {
    expect(refusal(hourly(8760, "Hour,Dry bulb [°C],Wet bulb [°C]", (h) => (h === 9 ? "10,12" : "10,8"))).problems[0]).toMatchObject({ row: 10, column: "Wet bulb [°C]" });
    expect(refusal(hourly(8760, "Hour,Dry bulb [°C],Dew point [°C]", (h) => (h === 9 ? "10,12" : "10,8"))).problems[0].message).toMatch(/cannot exceed/);
    expect(refusal(hourly(8760, "Hour,Dry bulb [°C],RH [%]", (h) => (h === 3 ? "75,50" : "10,50"))).problems[0]).toMatchObject({ row: 4, message: "75 °C is outside -90 to 60 °C" });
  });

  it("refuses a header without a humidity or time column, or with a unit it does not know", () => {
    expect(refusal("Hour,Dry bulb [°C]\n1,5\n").message).toMatch(/humidity column is required/);
    expect(refusal("Dry bulb [°C],RH [%]\n5,80\n").message).toMatch(/time column is required/);
    expect(refusal("Hour,Dry bulb [K],RH [%]\n1,280,80\n").problems[0]).toMatchObject({ row: 1, column: "Dry bulb [K]", message: expect.stringContaining('unit "k" is not understood') });
  });

  it("refuses a year that does not start on 1 January and a leap-year length that disagrees with the dates", () => {
    const shifted = [lines[0], ...lines.slice(25)].join("\n");
    expect(refusal(shifted).problems[0].message).toMatch(/must start at 1 January 00:00/);
    const long = yearToCsv({ year: 2025, dryBulbC: Array(8784).fill(5), rhPct: Array(8784).fill(80) });
    expect(refusal(long).problems[0]).toMatchObject({ row: 8785, column: "Timestamp", message: "2025 has 8760 hours; the file has 8784" });
  });

  it("refuses empty, binary, zipped and wrongly named files before reading them", () => {
    expect(refusal("").message).toBe("The file is empty.");
    expect(refusal(new Uint8Array([0x50, 0x4b, 0x03, 0x04, 1, 2])).message).toMatch(/ZIP archive/);
    expect(refusal(new Uint8Array([0x41, 0, 0x42])).message).toMatch(/binary data/);
    expect(refusal(invented, "weather.xlsx").message).toMatch(/neither .csv nor .epw/);
    expect(refusal(new Uint8Array([0x61, 0xff, 0xfe, 0x0a]), "x.csv").message).toMatch(/not UTF-8/);
    expect(refusal(new Uint8Array(4 * 1024 * 1024 + 1).fill(0x31)).message).toMatch(/at most 4 MB/);
  });
});

describe("EPW weather files", () => {
  it("reads the hourly rows after the eight header lines: dry bulb, RH, pressure; the weekday from DATA PERIODS", () => {
    const w = parseWeatherFile(enc(epw()), "nowhere.epw");
    expect(w.format).toBe("epw");
    expect(w.dryBulbC).toHaveLength(8760);
    expect(w.dryBulbC[0]).toBe(20);
    expect(w.rhPct[0]).toBe(52);
    expect(w.pressurePa).toBe(99000);
    expect(w.startWeekday).toBe(1); // "Tuesday" in the DATA PERIODS line
    expect(w.source.label).toBe("nowhere.epw (EPW, Nowhere Flats, Invented, XX, typical year)");
    expect(w.year).toBe(2025); // months from 1999 and 2003: a typical year, read as a non-leap year
  });

  it("computes RH from the dew point where RH is marked missing (999)", () => {
    // 20 °C, dew point 10 °C → 52.5 % (ASHRAE Handbook—Fundamentals 2017 ch. 1 table 3, as above)
    const w = parseWeatherFile(enc(epw(8760, (c, i) => i === 10 && (c[8] = "999"))), "n.epw");
    expect(w.rhPct[10]).toBeCloseTo(52.5, 1);
  });

  it("refuses a gap, a missing dry bulb, text in a number, RH over 100 % and a short year, each by row and field", () => {
    const text = epw();
    const ls = text.split("\r\n");
    ls.splice(8 + 300, 1);
    const gap = refusal(ls.join("\r\n"), "g.epw");
    expect(gap.problems[0]).toMatchObject({ row: 309, column: "Hour (field 4)", message: expect.stringMatching(/expected 13 Jan hour 13, found 13 Jan hour 14/) });
    expect(refusal(epw(8760, (c, i) => i === 5 && (c[6] = "99.9")), "m.epw").problems[0]).toMatchObject({ row: 14, column: "Dry bulb °C (field 7)", message: expect.stringMatching(/missing/) });
    expect(refusal(epw(8760, (c, i) => i === 6 && (c[6] = "n/a")), "t.epw").problems[0]).toMatchObject({ row: 15, column: "Dry bulb °C (field 7)", message: '"n/a" is not a number' });
    expect(refusal(epw(8760, (c, i) => i === 7 && (c[8] = "101")), "r.epw").problems[0]).toMatchObject({ row: 16, column: "Relative humidity % (field 9)", message: expect.stringMatching(/over 100 %/) });
    const short = refusal(epw(8000), "s.epw");
    expect(short.problems.at(-1)).toMatchObject({ row: 8008, column: "Hour (field 4)", message: expect.stringMatching(/8000 hourly rows/) });
  });

  it("refuses an .epw without its header lines", () => {
    expect(refusal(lines.join("\n"), "plain.epw").message).toMatch(/does not start with the EPW "LOCATION," line/);
    expect(refusal("LOCATION,x\n1,2,3\n", "x.epw").message).toMatch(/eight EPW header lines/);
  });
});

describe("summaries", () => {
  it("monthly means of the invented year follow its invented climate within 1.5 K", () => {
    const s = summarizeWeather(inventYear(HARROWFIELD_CLIMATE, { year: 2025, seed: 7 }));
    expect(s.hours).toBe(8760);
    s.months.forEach((m, i) => expect(Math.abs(m.meanDryBulbC - HARROWFIELD_CLIMATE[i].meanDryBulbC)).toBeLessThan(1.5 + 3 / Math.sqrt(3)));
    expect(s.maxDryBulbC).toBeGreaterThan(s.months[6].meanDryBulbC);
  });
});
