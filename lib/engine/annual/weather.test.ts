import { describe, expect, it } from "vitest";
import { calendarOf, hourLabel, sineDayYear, weekdayOfJan1 } from "./weather";

const CLIMATE = {
  label: "test climate",
  meanDryBulbC: [-5, -3, 2, 8, 13, 17, 20, 19, 15, 9, 3, -2],
  dailyRangeK: [5, 6, 8, 10, 11, 12, 12, 11, 10, 8, 6, 5],
  meanRhPct: [90, 85, 80, 75, 70, 68, 65, 67, 72, 80, 88, 92],
};

describe("calendar", () => {
  it("weekday of 1 January (Zeller's congruence; checked against known dates)", () => {
    expect(weekdayOfJan1(2025)).toBe(2); // Wednesday
    expect(weekdayOfJan1(2024)).toBe(0); // Monday
    expect(weekdayOfJan1(2023)).toBe(6); // Sunday
    expect(weekdayOfJan1(2000)).toBe(5); // Saturday
  });
  it("months, days and weekdays of every hour", () => {
    const c = calendarOf(8784, 0);
    expect(c.days).toBe(366);
    expect(c.daysInMonth[1]).toBe(29);
    expect(hourLabel(c, 59 * 24 + 13)).toBe("Feb 29 (Thu) 13:00");
    expect(hourLabel(c, 8783)).toBe("Dec 31 (Tue) 23:00");
    const n = calendarOf(8760, 2);
    expect(hourLabel(n, 8759)).toBe("Dec 31 (Wed) 23:00");
  });
});

describe("sine-day year from monthly means (stated approximation)", () => {
  it("keeps each month's mean dry bulb exactly, its daily range, and RH within 0–100 %", () => {
    const w = sineDayYear(CLIMATE, 2025);
    expect(w.dryBulbC.length).toBe(8760);
    expect(w.startWeekday).toBe(2);
    expect(w.source.kind).toBe("monthly");
    expect(w.source.label).toMatch(/approximation/);
    const cal = calendarOf(8760, w.startWeekday);
    for (let m = 0; m < 12; m++) {
      let sum = 0;
      let n = 0;
      for (let i = 0; i < 8760; i++)
        if (cal.month[i] === m) {
          sum += w.dryBulbC[i];
          n++;
        }
      expect(sum / n).toBeCloseTo(CLIMATE.meanDryBulbC[m], 9);
    }
    // Highest at 15:00, lowest at 03:00, range as given (1 July).
    const day = 181 * 24;
    const jul = w.dryBulbC.slice(day, day + 24);
    expect(jul.indexOf(Math.max(...jul))).toBe(15);
    expect(jul.indexOf(Math.min(...jul))).toBe(3);
    expect(Math.max(...jul) - Math.min(...jul)).toBeCloseTo(12, 9);
    for (const rh of w.rhPct) {
      expect(rh).toBeGreaterThan(0);
      expect(rh).toBeLessThanOrEqual(100);
    }
    // Constant moisture through the day: more humid at night than by day.
    expect(w.rhPct[day + 3]).toBeGreaterThan(w.rhPct[day + 15]);
  });
  it("a leap year has 8784 hours", () => {
    expect(sineDayYear(CLIMATE, 2024).dryBulbC.length).toBe(8784);
  });
});
