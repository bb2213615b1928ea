/**
 * Checks an .xlsx (a ZIP container) before any spreadsheet library inflates it: entry count,
 * declared uncompressed sizes, compression ratio, compression method, and — because declared
 * sizes can lie — inflates each entry with a hard output cap. A zip bomb is refused with a
 * clear message and nothing beyond the caps is ever held in memory.
 */
import { inflateRawSync } from "node:zlib";

export interface ZipLimits {
  maxEntries: number;
  maxTotalUncompressedBytes: number;
  maxEntryUncompressedBytes: number;
  /** Uncompressed / compressed, per entry. */
  maxRatio: number;
}

/**
 * An import holds at most 1000 rows of 40 columns: its sheet XML is about 1–4 MB even with
 * inline text in every cell. The caps allow that and little more, because the spreadsheet
 * library's time and memory grow with the inflated size. Measured here (2 cores, busy) on the
 * worst workbook each cap lets through (one 40-column sheet as large as the part cap, under
 * 2 MB compressed): 20 MB per part took 2.8–4.0 s and 220–240 MB more memory before it was
 * refused for its row count; 4 MB per part takes 0.75–0.83 s and 47–49 MB.
 */
export const XLSX_LIMITS: ZipLimits = {
  maxEntries: 200,
  maxTotalUncompressedBytes: 6 * 1024 * 1024,
  maxEntryUncompressedBytes: 4 * 1024 * 1024,
  maxRatio: 150,
};

export class ImportFileError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "ImportFileError";
  }
}

const EOCD_SIG = 0x06054b50;
const CDIR_SIG = 0x02014b50;
const LOCAL_SIG = 0x04034b50;

function findEndOfCentralDirectory(buf: Buffer): number {
  // The record is 22 bytes plus a comment of at most 65 535 bytes, at the very end.
  const stop = Math.max(0, buf.length - 22 - 65_535);
  for (let i = buf.length - 22; i >= stop; i--) if (buf.readUInt32LE(i) === EOCD_SIG) return i;
  return -1;
}

export interface ZipEntryInfo {
  name: string;
  compressedBytes: number;
  uncompressedBytes: number;
}

/** Throws ImportFileError unless the ZIP is well-formed and within `limits`; returns its entries. */
export function inspectZip(buf: Buffer, limits: ZipLimits = XLSX_LIMITS): ZipEntryInfo[] {
  const bad = (why: string): never => {
    throw new ImportFileError(`The file is not a valid .xlsx workbook (${why}). Save it again from your spreadsheet program as "Excel Workbook (.xlsx)".`);
  };
  if (buf.length < 22 || buf.readUInt32LE(0) !== LOCAL_SIG) bad("it does not start like a ZIP container");
  const eocd = findEndOfCentralDirectory(buf);
  if (eocd < 0) bad("no ZIP directory at its end");
  const count = buf.readUInt16LE(eocd + 10);
  const dirSize = buf.readUInt32LE(eocd + 12);
  const dirOffset = buf.readUInt32LE(eocd + 16);
  if (count === 0xffff || dirOffset === 0xffffffff) bad("ZIP64 containers are not accepted");
  if (count > limits.maxEntries) throw new ImportFileError(`The workbook holds ${count} parts; at most ${limits.maxEntries} are accepted. Remove unused sheets, images or embedded objects.`);
  if (dirOffset + dirSize > eocd) bad("its directory points outside the file");
  const entries: ZipEntryInfo[] = [];
  let total = 0;
  let p = dirOffset;
  for (let i = 0; i < count; i++) {
    if (p + 46 > buf.length || buf.readUInt32LE(p) !== CDIR_SIG) bad("a damaged directory entry");
    const method = buf.readUInt16LE(p + 10);
    const compressed = buf.readUInt32LE(p + 20);
    const uncompressed = buf.readUInt32LE(p + 24);
    const nameLen = buf.readUInt16LE(p + 28);
    const extraLen = buf.readUInt16LE(p + 30);
    const commentLen = buf.readUInt16LE(p + 32);
    const localOffset = buf.readUInt32LE(p + 42);
    const name = buf.toString("utf8", p + 46, p + 46 + nameLen);
    p += 46 + nameLen + extraLen + commentLen;
    if (method !== 0 && method !== 8) bad(`part "${name}" uses an unsupported compression method`);
    if (uncompressed > limits.maxEntryUncompressedBytes || (compressed > 0 && uncompressed / compressed > limits.maxRatio) || (compressed === 0 && uncompressed > 0))
      throw new ImportFileError(`The workbook's part "${name}" would expand to ${uncompressed.toLocaleString("en-GB")} bytes from ${compressed.toLocaleString("en-GB")}: refused as a possible zip bomb. Nothing was imported.`);
    total += uncompressed;
    if (total > limits.maxTotalUncompressedBytes)
      throw new ImportFileError(`The workbook would expand to more than ${(limits.maxTotalUncompressedBytes / 1048576).toFixed(0)} MB: refused as too large (or a zip bomb). Nothing was imported.`);
    // Verify the declared size by inflating with a cap: a lying header cannot make it bigger.
    if (localOffset + 30 > buf.length || buf.readUInt32LE(localOffset) !== LOCAL_SIG) bad(`part "${name}" is missing`);
    const dataStart = localOffset + 30 + buf.readUInt16LE(localOffset + 26) + buf.readUInt16LE(localOffset + 28);
    const data = buf.subarray(dataStart, dataStart + compressed);
    if (data.length !== compressed) bad(`part "${name}" is cut short`);
    if (method === 8) {
      let out: Buffer;
      try {
        out = inflateRawSync(data, { maxOutputLength: Math.max(1, uncompressed) });
      } catch {
        throw new ImportFileError(`The workbook's part "${name}" expands beyond its declared size or is damaged: refused. Nothing was imported.`);
      }
      if (out.length !== uncompressed) bad(`part "${name}" does not match its declared size`);
    } else if (compressed !== uncompressed) bad(`stored part "${name}" has inconsistent sizes`);
    entries.push({ name, compressedBytes: compressed, uncompressedBytes: uncompressed });
  }
  if (!entries.some((e) => e.name === "[Content_Types].xml")) bad("no [Content_Types].xml part");
  return entries;
}
