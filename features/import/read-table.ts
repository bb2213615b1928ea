/**
 * Reads an uploaded table — the first worksheet of an .xlsx, or a CSV (comma, semicolon or tab
 * separated, UTF-8) — into a header row and data rows, after the type, size and ZIP checks.
 */
import ExcelJS from "exceljs";
import { ImportFileError, inspectZip } from "./zip-guard";

export const MAX_UPLOAD_BYTES = 2 * 1024 * 1024;
export const MAX_ROWS = 1000;
export const MAX_COLUMNS = 40;

export type CellValue = string | number | null;

export interface Table {
  headers: string[];
  /** Data rows with their 1-based row number in the file. */
  rows: { rowNumber: number; cells: CellValue[] }[];
  format: "xlsx" | "csv";
}

/** RFC 4180 with the delimiter found from the header line (";" where decimal commas are usual). */
export function parseCsv(text: string): string[][] {
  const firstLine = text.slice(0, text.search(/\r?\n|$/));
  const counts = { ",": 0, ";": 0, "\t": 0 } as Record<string, number>;
  let q = false;
  for (const ch of firstLine) {
    if (ch === '"') q = !q;
    else if (!q && ch in counts) counts[ch]++;
  }
  const delim = (Object.entries(counts).sort((a, b) => b[1] - a[1])[0][1] > 0 ? Object.entries(counts).sort((a, b) => b[1] - a[1])[0][0] : ",") as string;
  const rows: string[][] = [];
  let row: string[] = [];
  let field = "";
  let quoted = false;
  let i = 0;
  const endField = () => {
    row.push(field);
    field = "";
  };
  const endRow = () => {
    endField();
    rows.push(row);
    row = [];
  };
  while (i < text.length) {
    const ch = text[i];
    if (quoted) {
      if (ch === '"' && text[i + 1] === '"') {
        field += '"';
        i += 2;
        continue;
      }
      if (ch === '"') quoted = false;
      else field += ch;
      i++;
      continue;
    }
    if (ch === '"' && field === "") quoted = true;
    else if (ch === delim) endField();
    else if (ch === "\r" && text[i + 1] === "\n") {
      endRow();
      i++;
    } else if (ch === "\n" || ch === "\r") endRow();
    else field += ch;
    i++;
  }
  if (quoted) throw new ImportFileError("The CSV has a quote that is never closed: check the file, then upload it again.");
  if (field !== "" || row.length > 0) endRow();
  return rows;
}

function cellValue(v: ExcelJS.CellValue): CellValue {
  if (v === null || v === undefined) return null;
  if (typeof v === "number") return v;
  if (typeof v === "string") return v;
  if (typeof v === "boolean") return v ? "true" : "false";
  if (v instanceof Date) return v.toISOString().slice(0, 10);
  if (typeof v === "object") {
    if ("richText" in v) return v.richText.map((t) => t.text).join("");
    // A formula is never evaluated here: its cached result is read, as the spreadsheet showed it.
    if ("formula" in v || "sharedFormula" in v) {
      const r = (v as { result?: unknown }).result;
      return typeof r === "number" || typeof r === "string" ? r : null;
    }
    if ("text" in v) return String((v as { text: unknown }).text);
    if ("error" in v) return String((v as { error: unknown }).error);
  }
  return String(v);
}

function checkShape(headers: string[], count: number) {
  if (headers.length === 0 || headers.every((h) => h.trim() === "")) throw new ImportFileError("The first row must hold the column headers; it is empty.");
  if (headers.length > MAX_COLUMNS) throw new ImportFileError(`The table has ${headers.length} columns; at most ${MAX_COLUMNS} are read.`);
  if (count === 0) throw new ImportFileError("The table has headers but no data rows.");
  if (count > MAX_ROWS) throw new ImportFileError(`The table has ${count} data rows; at most ${MAX_ROWS} are accepted in one import.`);
}

/** Reads an upload; the format comes from the content (ZIP signature or UTF-8 text), checked against the file name. */
export async function readTable(buf: Buffer, fileName: string): Promise<Table> {
  if (buf.length === 0) throw new ImportFileError("The file is empty.");
  if (buf.length > MAX_UPLOAD_BYTES) throw new ImportFileError(`The file is ${(buf.length / 1048576).toFixed(1)} MB; at most ${MAX_UPLOAD_BYTES / 1048576} MB is accepted.`);
  const ext = (/\.([a-z0-9]+)$/i.exec(fileName)?.[1] ?? "").toLowerCase();
  const isZip = buf.length >= 4 && buf.readUInt32LE(0) === 0x04034b50;
  if (ext === "xlsx" || isZip) {
    if (ext !== "xlsx") throw new ImportFileError(`"${fileName}" is a ZIP container but not named .xlsx; upload an .xlsx workbook or a .csv file.`);
    inspectZip(buf);
    const wb = new ExcelJS.Workbook();
    try {
      await wb.xlsx.load(buf as unknown as ArrayBuffer);
    } catch {
      throw new ImportFileError("The workbook could not be read. Save it again as \"Excel Workbook (.xlsx)\" and upload it again.");
    }
    const ws = wb.worksheets[0];
    if (!ws) throw new ImportFileError("The workbook has no worksheet.");
    if (ws.rowCount > MAX_ROWS + 1) throw new ImportFileError(`The first sheet has ${ws.rowCount - 1} data rows; at most ${MAX_ROWS} are accepted in one import.`);
    const headers: string[] = [];
    ws.getRow(1).eachCell({ includeEmpty: true }, (c, col) => {
      if (col <= MAX_COLUMNS + 1) headers[col - 1] = String(cellValue(c.value) ?? "").trim();
    });
    const rows: Table["rows"] = [];
    ws.eachRow((row, n) => {
      if (n === 1) return;
      const cells: CellValue[] = headers.map((_, i) => cellValue(row.getCell(i + 1).value));
      if (cells.some((c) => c !== null && String(c).trim() !== "")) rows.push({ rowNumber: n, cells });
    });
    checkShape(headers, rows.length);
    return { headers, rows, format: "xlsx" };
  }
  if (ext !== "csv" && ext !== "txt") throw new ImportFileError(`"${fileName}" is neither .xlsx nor .csv. Upload an Excel workbook (.xlsx) or a CSV file.`);
  if (buf.includes(0)) throw new ImportFileError("The CSV contains binary data (a zero byte); it must be plain UTF-8 text.");
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(buf);
  } catch {
    throw new ImportFileError("The CSV is not UTF-8 text. Save it as \"CSV UTF-8\" and upload it again.");
  }
  const [head, ...data] = parseCsv(text.replace(/^\uFEFF/, ""));
  const headers = (head ?? []).map((h) => h.trim());
  // Row numbers are the record's place in the file (header = row 1), blank records skipped.
  const rows = data
    .map((cells, i) => ({ rowNumber: i + 2, cells: headers.map((_, j): CellValue => (cells[j] === undefined || cells[j].trim() === "" ? null : cells[j])) }))
    .filter((r) => r.cells.some((c) => c !== null));
  checkShape(headers, rows.length);
  return { headers, rows, format: "csv" };
}
