import { deflateRawSync } from "node:zlib";
import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import { roomSchema } from "@/lib/engine/loads/schema";
import { inspectZip, ImportFileError } from "./zip-guard";
import { readTable, parseCsv, type Table } from "./read-table";
import { readNumber, splitHeader } from "./columns";
import { planRooms, planStocking, roomDoc, parseConstruction } from "./plans";

/** A minimal ZIP writer for the checks: deflated entries, optionally with a lying declared size. */
function zip(entries: { name: string; data: Buffer; declaredSize?: number }[]): Buffer {
  const locals: Buffer[] = [];
  const dirs: Buffer[] = [];
  let offset = 0;
  for (const e of entries) {
    const comp = deflateRawSync(e.data);
    const name = Buffer.from(e.name);
    const size = e.declaredSize ?? e.data.length;
    const lh = Buffer.alloc(30);
    lh.writeUInt32LE(0x04034b50, 0);
    lh.writeUInt16LE(20, 4);
    lh.writeUInt16LE(8, 8);
    lh.writeUInt32LE(comp.length, 18);
    lh.writeUInt32LE(size, 22);
    lh.writeUInt16LE(name.length, 26);
    locals.push(lh, name, comp);
    const cd = Buffer.alloc(46);
    cd.writeUInt32LE(0x02014b50, 0);
    cd.writeUInt16LE(20, 4);
    cd.writeUInt16LE(20, 6);
    cd.writeUInt16LE(8, 10);
    cd.writeUInt32LE(comp.length, 20);
    cd.writeUInt32LE(size, 24);
    cd.writeUInt16LE(name.length, 28);
    cd.writeUInt32LE(offset, 42);
    dirs.push(cd, name);
    offset += 30 + name.length + comp.length;
  }
  const dir = Buffer.concat(dirs);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(entries.length, 8);
  end.writeUInt16LE(entries.length, 10);
  end.writeUInt32LE(dir.length, 12);
  end.writeUInt32LE(offset, 16);
  return Buffer.concat([...locals, dir, end]);
}

async function xlsx(rows: (string | number)[][]): Promise<Buffer> {
  const wb = new ExcelJS.Workbook();
  const ws = wb.addWorksheet("Rooms");
  rows.forEach((r) => ws.addRow(r));
  return Buffer.from(await wb.xlsx.writeBuffer());
}

const table = (headers: string[], rows: (string | number | null)[][]): Table => ({ headers, rows: rows.map((cells, i) => ({ rowNumber: i + 2, cells })), format: "csv" });

describe("upload checks", () => {
  it("accepts a workbook written by exceljs", async () => {
    const buf = await xlsx([["Name", "Length [m]"], ["A", 10]]);
    expect(inspectZip(buf).length).toBeGreaterThan(3);
    const t = await readTable(buf, "rooms.xlsx");
    expect(t.headers).toEqual(["Name", "Length [m]"]);
    expect(t.rows[0]).toEqual({ rowNumber: 2, cells: ["A", 10] });
  });

  it("refuses a zip bomb by its compression ratio before anything is inflated beyond the caps", () => {
    // 30 MB of zeros deflates to about 30 kB: a ratio near 1000 (limit 150).
    const bomb = zip([
      { name: "[Content_Types].xml", data: Buffer.from("<Types/>") },
      { name: "xl/worksheets/sheet1.xml", data: Buffer.alloc(30 * 1024 * 1024) },
    ]);
    expect(() => inspectZip(bomb)).toThrow(/zip bomb/);
  });

  it("refuses a plausible workbook part over 4 MB inflated (within the ratio and the 2 MB upload), and takes a full 1000 × 40 sheet", async () => {
    // Varied cells compress about 10:1, far under the ratio cap: only the size cap stops this one.
    let seed = 7;
    const cell = (r: number, c: number) => {
      seed = (seed * 1103515245 + 12345) & 0x7fffffff;
      return `<c r="${String.fromCharCode(65 + (c % 26))}${r}"><v>${seed % 97}</v></c>`;
    };
    const rows: string[] = [];
    for (let r = 1, size = 0; size < 5 * 1024 * 1024; r++) {
      const row = `<row r="${r}">${Array.from({ length: 40 }, (_, c) => cell(r, c)).join("")}</row>`;
      rows.push(row);
      size += row.length;
    }
    const big = zip([
      { name: "[Content_Types].xml", data: Buffer.from("<Types/>") },
      { name: "xl/worksheets/sheet1.xml", data: Buffer.from(`<worksheet><sheetData>${rows.join("")}</sheetData></worksheet>`) },
    ]);
    expect(big.length).toBeLessThan(2 * 1024 * 1024);
    expect(() => inspectZip(big)).toThrow(/would expand to 5[\d,]+ bytes/);
    // The largest import allowed (1000 data rows, 40 columns of short text) passes the guard.
    const full = await xlsx([Array.from({ length: 40 }, (_, c) => `Column ${c}`), ...Array.from({ length: 1000 }, (_, r) => Array.from({ length: 40 }, (_, c) => `room ${r} value ${c}`))]);
    expect(inspectZip(full).length).toBeGreaterThan(3);
  });

  it("refuses an entry that inflates beyond its declared size", () => {
    const liar = zip([
      { name: "[Content_Types].xml", data: Buffer.from("<Types/>") },
      { name: "xl/sharedStrings.xml", data: Buffer.from("x".repeat(5000) + "y".repeat(5000)), declaredSize: 100 },
    ]);
    expect(() => inspectZip(liar)).toThrow(ImportFileError);
  });

  it("refuses malformed and mistyped files with a clear message", async () => {
    await expect(readTable(Buffer.from("PK\u0003\u0004 not really a zip"), "x.xlsx")).rejects.toThrow(/not a valid \.xlsx/);
    await expect(readTable(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0, 1, 2]), "image.png")).rejects.toThrow(/neither \.xlsx nor \.csv/);
    await expect(readTable(Buffer.from("a,b\n1,\u0000"), "x.csv")).rejects.toThrow(/binary data/);
    await expect(readTable(Buffer.from([0x61, 0x2c, 0xff, 0xfe, 0x0a]), "x.csv")).rejects.toThrow(/not UTF-8/);
    await expect(readTable(Buffer.alloc(3 * 1024 * 1024, 0x41), "big.csv")).rejects.toThrow(/at most 2 MB/);
    await expect(readTable(Buffer.from("name;length\n"), "x.csv")).rejects.toThrow(/no data rows/);
  });
});

describe("numbers and units", () => {
  it("reads decimal commas, refuses ambiguous numbers, and splits units from headers", () => {
    expect(readNumber("12,5")).toEqual({ ok: true, value: 12.5 });
    expect(readNumber("−3.5")).toEqual({ ok: true, value: -3.5 });
    expect(readNumber(7)).toEqual({ ok: true, value: 7 });
    expect(readNumber("1,234")).toMatchObject({ ok: false, message: expect.stringContaining("ambiguous") });
    expect(readNumber("1.234,5")).toMatchObject({ ok: false });
    expect(readNumber("abc")).toMatchObject({ ok: false });
    expect(splitHeader("Set point [°F]")).toEqual({ name: "set point", unit: "°f" });
    expect(splitHeader("Length (ft)")).toEqual({ name: "length", unit: "ft" });
    expect(splitHeader("Intake t/day")).toEqual({ name: "intake", unit: "t/day" });
  });

  it("reads a semicolon CSV with decimal commas", () => {
    expect(parseCsv('name;length [m]\r\n"Store; north";12,5\r\n')).toEqual([
      ["name", "length [m]"],
      ["Store; north", "12,5"],
    ]);
  });
});

describe("room list import", () => {
  it("converts IP units in the headers to SI (NIST SP 811: 1 ft = 0.3048 m; °C = (°F − 32)/1.8)", () => {
    const p = planRooms(table(["Name", "Length [ft]", "Width [ft]", "Height [ft]", "Set point [°F]", "Construction"], [["Chiller 1", 100, 50, 30, 35.6, "PIR 150"]]), []);
    expect(p.errors).toEqual([]);
    const r = p.items[0];
    expect(r.lengthM).toBeCloseTo(30.48, 10);
    expect(r.heightM).toBeCloseTo(9.144, 10);
    expect(r.setPointC).toBeCloseTo(2, 10); // (35.6 − 32) / 1.8 = 2
    expect(r.construction).toEqual({ material: "PIR", thicknessM: 0.15, conductivityWmK: 0.023 });
    // The generated room is a valid ledger room.
    expect(roomSchema.safeParse(roomDoc(r)).success).toBe(true);
  });

  it("names the row and the column of every error, and commits nothing when one row is bad", () => {
    const p = planRooms(
      table(["Name", "Length [m]", "Width [m]", "Height [m]", "Set point [°C]", "Construction"], [
        ["Good", 10, 10, 6, 2, "PUR 120 mm"],
        ["Bad", "ten", 10, 6, -90, "straw bales"],
        ["good", 10, 10, 6, 2, null],
      ]),
      [],
    );
    expect(p.errors).toEqual(
      expect.arrayContaining([
        { row: 3, column: "Length [m]", message: expect.stringContaining('"ten" is not a number') },
        { row: 3, column: "Set point [°C]", message: "set point must be between −60 and 40 °C" },
        { row: 3, column: "Construction", message: expect.stringContaining("straw bales") },
        { row: 4, column: "Name", message: '"good" is already on row 2' },
      ]),
    );
  });

  it("refuses a unit it does not understand, naming the column", () => {
    const p = planRooms(table(["Name", "Length [yd]", "Width", "Height", "Set point"], [["A", 1, 1, 1, 1]]), []);
    expect(p.errors[0]).toMatchObject({ row: 1, column: "Length [yd]", message: expect.stringContaining('unit "yd"') });
    expect(p.notes.join(" ")).toContain('"Width" read in m (no unit in the header)');
  });

  it("updates rooms that exist by name and keeps their ids", () => {
    const p = planRooms(table(["Name", "Length", "Width", "Height", "Set point"], [["Dock", 20, 10, 8, 4]]), [{ id: "dock", name: "dock" }]);
    expect(p.items[0]).toMatchObject({ id: "dock", existing: true, setPointC: 4 });
    // No RH or kind column: the existing room keeps its own.
    expect(p.items[0].rhPct).toBeUndefined();
    expect(p.items[0].kind).toBeUndefined();
    expect(parseConstruction("U 0,25")).toEqual({ material: "given U-value", uValueWm2K: 0.25 });
  });
});

describe("stocking plan import", () => {
  const rooms = [
    { id: "apples", name: "Produce room +2 °C (apples)" },
    { id: "dock", name: "Loading dock" },
  ];
  const commodities = [{ id: "apples", name: "Apples" }];

  it("turns rows into the stocking check's changes, with kg/day and a decimal comma read", () => {
    const p = planStocking(table(["Room", "Commodity", "Intake [kg/day]", "Entering [°C]", "Pull-down [h]"], [["apples", "Apples", "18500", "18,5", 24]]), rooms, commodities);
    expect(p.errors).toEqual([]);
    expect(p.items).toEqual([{ roomId: "apples", commodityId: "apples", tonnesPerDay: 18.5, enteringTempC: 18.5, pullDownHours: 24 }]);
  });

  it("names unknown rooms and commodities by row and column", () => {
    const p = planStocking(table(["Room", "Commodity", "Intake"], [["Attic", "Moon cheese", 3]]), rooms, commodities);
    expect(p.errors).toEqual([
      { row: 2, column: "Room", message: 'no room "Attic" in this facility' },
      { row: 2, column: "Commodity", message: '"Moon cheese" is not in the commodity library' },
    ]);
    expect(p.items).toEqual([]);
  });
});
