/**
 * Opens a climate file (plain or gzip, told apart by the gzip magic bytes), detects its layout from
 * its first lines, and streams it through the matching reader. A file is never held whole in memory
 * as one string: every reader takes the lines split here from the decompressed byte chunks, a line
 * longer than MAX_LINE_BYTES being one malformed record.
 */
import { type FileHandle, open } from "node:fs/promises";
import { basename } from "node:path";
import type { Readable } from "node:stream";
import { createGunzip, type ZlibOptions } from "node:zlib";
import { inputError } from "../errors.js";
import { type CsvLineState, parseCsvLine } from "./csvHourly.js";
import {
  createIsdLineState,
  flushCalls,
  type IsdLineState,
  looksLikeIsdLine,
  parseIsdLine,
} from "./isdFull.js";
import { looksLikeLiteLine, parseLiteLine, stationIdFromFileName } from "./isdLite.js";
import { parseSessionsAvailable, startParseSession } from "./pool.js";
import {
  emptyParsedFile,
  noteMalformed,
  type ParsedFile,
  pushMalformed,
  resolveUnknownStations,
  UNKNOWN_STATION,
} from "./records.js";
import { applyYearRules } from "./years.js";

/** Bytes per read and per decompressed chunk, the same for the reader and the decompress-only baseline. */
export const CHUNK_BYTES = 256 * 1024;
/** How far decompression may run ahead of the reader. */
const READ_AHEAD_BYTES = 8 * CHUNK_BYTES;
/** A "line" longer than this is garbage: ISD records are at most 105 + 9999 characters. */
const MAX_LINE_BYTES = 16 * 1024;
/** How much of the start of a file is looked at to detect its layout. */
const DETECT_BYTES = 64 * 1024;

/** A climate file opened once: its handle, whether it is gzip, and its size on disk and as text. */
interface OpenInput {
  path: string;
  fh: FileHandle;
  /** True when the file starts with the gzip magic bytes 1f 8b (RFC 1952). */
  gz: boolean;
  /**
   * Its text size: the gzip ISIZE trailer (the last 4 bytes: the uncompressed size modulo 2^32, RFC
   * 1952 section 2.3.1), not trusted beyond 16 times the compressed size (ISD text compresses about 6
   * to 1); the file size of a plain file.
   */
  textBytes: number;
}

/** Input errors for a file that cannot be opened or read. */
function readError(path: string, err: unknown): unknown {
  const e = err as NodeJS.ErrnoException;
  if (e.code === "ENOENT") return inputError(path, undefined, undefined, "file not found");
  if (e.code === "EACCES" || e.code === "EPERM")
    return inputError(path, undefined, undefined, "cannot read the climate file: permission denied");
  return err;
}

/** Opens a climate file and reads what is known before its content: gzip or not, its text size. */
async function openInput(path: string): Promise<OpenInput> {
  let fh: FileHandle;
  try {
    fh = await open(path, "r");
  } catch (err) {
    throw readError(path, err);
  }
  try {
    const size = (await fh.stat()).size;
    const bytes = Buffer.alloc(4);
    const { bytesRead } = await fh.read(bytes, 0, 2, 0);
    const gz = bytesRead === 2 && bytes[0] === 0x1f && bytes[1] === 0x8b;
    let textBytes = size;
    if (gz && size >= 18) {
      await fh.read(bytes, 0, 4, size - 4);
      textBytes = Math.min(bytes.readUInt32LE(0), size * 16);
    }
    return { path, fh, gz, textBytes };
  } catch (err) {
    await fh.close();
    throw readError(path, err);
  }
}

/**
 * The file's decompressed bytes as a stream of chunks of about CHUNK_BYTES. Errors of the gzip layer
 * (a file cut short, a damaged stream) become input errors naming the file.
 */
export async function* readChunks(path: string): AsyncGenerator<Buffer> {
  yield* chunksOf(await openInput(path));
}

/** The decompressed chunks of an opened file; the file is closed when the stream ends or stops. */
async function* chunksOf({ path, fh, gz }: OpenInput): AsyncGenerator<Buffer> {
  const raw = fh.createReadStream({ start: 0, highWaterMark: CHUNK_BYTES });
  // The gunzip side may run ahead by a few chunks, so that decompression (on libuv's thread pool)
  // overlaps with parsing on the main thread.
  const stream: Readable = gz
    ? raw.pipe(createGunzip({ chunkSize: CHUNK_BYTES, highWaterMark: READ_AHEAD_BYTES } as ZlibOptions))
    : raw;
  if (gz) raw.on("error", (err) => stream.destroy(err));
  try {
    for await (const chunk of stream) yield chunk as Buffer;
  } catch (err) {
    const e = err as NodeJS.ErrnoException;
    if (gz && typeof e.code === "string" && e.code.startsWith("Z_"))
      throw inputError(
        path,
        undefined,
        "gzip",
        e.code === "Z_BUF_ERROR"
          ? "gzip data ends early (file cut short?); expected a complete gzip file"
          : `damaged gzip data (${e.message}); expected a complete gzip file`,
      );
    throw readError(path, err);
  } finally {
    raw.destroy();
  }
}

export type ClimateFormat = ParsedFile["format"];

/** Splits the first bytes of a file into lines (for detection only). */
function headLines(head: Buffer): [number, number][] {
  const out: [number, number][] = [];
  let pos = 0;
  while (pos < head.length && out.length < 20) {
    let nl = head.indexOf(10, pos);
    if (nl < 0) nl = head.length;
    let end = nl;
    if (end > pos && head[end - 1] === 13) end--;
    if (end > pos) out.push([pos, end]);
    pos = nl + 1;
  }
  return out;
}

/** Detects the layout from the first lines: CSV header, else the majority of full vs Lite lines. */
export function detectFormat(head: Buffer): ClimateFormat | null {
  let start = 0;
  if (head[0] === 0xef && head[1] === 0xbb && head[2] === 0xbf) start = 3; // UTF-8 byte-order mark
  const first = head.subarray(start, Math.min(head.length, start + 200)).toString("latin1");
  if (/^"?STATION"?,/.test(first) && /(^|,)"?DATE"?(,|\r?\n|$)/m.test(first.split("\n")[0] ?? ""))
    return "csv";
  let full = 0;
  let lite = 0;
  for (const [s, e] of headLines(head)) {
    if (looksLikeIsdLine(head, s, e)) full++;
    else if (looksLikeLiteLine(head, s, e)) lite++;
  }
  if (full === 0 && lite === 0) return null;
  return full >= lite ? "isd" : "isd-lite";
}

export interface ReadOptions {
  /** Station id for ISD-Lite files whose name does not carry it. */
  stationIdOverride?: string | undefined;
  /**
   * Files expected to hold at least this many records are parsed on a worker thread while this
   * thread decompresses them (default PARSE_WORKER_MIN_RECORDS; where the compiled worker exists).
   */
  parseOnWorkerFromRecords?: number | undefined;
}

/**
 * Reads one climate file into record columns (no quality control yet).
 * Throws InputError for an empty file, a file in none of the three layouts, or broken gzip data.
 */
export async function readClimateFile(path: string, options: ReadOptions = {}): Promise<ParsedFile> {
  const input = await openInput(path);
  const it = chunksOf(input);
  try {
    return await readFrom(path, it, options, input.textBytes);
  } finally {
    await it.return(undefined); // closes the file when reading stopped early
  }
}

async function readFrom(
  path: string,
  it: AsyncGenerator<Buffer>,
  options: ReadOptions,
  textBytes: number,
): Promise<ParsedFile> {
  const headChunks: Buffer[] = [];
  let headLen = 0;
  let done = false;
  while (headLen < DETECT_BYTES) {
    const r = await it.next();
    if (r.done) {
      done = true;
      break;
    }
    headChunks.push(r.value);
    headLen += r.value.length;
  }
  const head = headChunks.length === 1 ? headChunks[0]! : Buffer.concat(headChunks);
  if (done && head.every((c) => c === 10 || c === 13 || c === 32 || c === 9))
    throw inputError(path, undefined, undefined, "file is empty; expected ISD climate records");
  const format = detectFormat(head);
  if (format === null)
    throw inputError(
      path,
      1,
      undefined,
      "not a climate file: expected the ISD full format, ISD-Lite or the comma-separated global-hourly layout",
    );
  const rest = done ? null : it;
  const capacity = estimateRecords(textBytes, head);
  let file = emptyParsedFile(path, format, capacity);
  if (capacity >= (options.parseOnWorkerFromRecords ?? PARSE_WORKER_MIN_RECORDS) && parseSessionsAvailable())
    file = await readLinesOnWorker(path, head, rest, format, options, capacity);
  else await readLines(file, head, rest, format, options);
  resolveUnknownStations(file.records);
  applyYearRules(file);
  if (file.stations.length === 0)
    throw inputError(
      path,
      undefined,
      undefined,
      "no readable record in the file; expected ISD climate records",
    );
  return file;
}

/** Most records the columns are sized for up front (more still fit: the columns grow). */
const MAX_PRESIZED_RECORDS = 1 << 22;

/**
 * About how many records the file holds, to size the record columns once instead of growing them:
 * its text size over the mean line length of its first bytes.
 */
function estimateRecords(textBytes: number, head: Buffer): number {
  let lines = 0;
  for (let nl = head.indexOf(10); nl >= 0; nl = head.indexOf(10, nl + 1)) lines++;
  if (lines === 0) return 0;
  return Math.min(MAX_PRESIZED_RECORDS, Math.ceil((textBytes / head.length) * lines * 1.02) + 64);
}

/**
 * Where the lines of a file go: the full-format parser's state, the Lite file's station or the CSV
 * header's columns; and the unfinished line at the end of the last chunk. A plain object and plain
 * functions (no closures made per file), so that the optimised line loop serves every file alike.
 */
export interface LineReader {
  file: ParsedFile;
  isd: IsdLineState | null; // full format only
  liteStation: number; // ISD-Lite only
  csv: CsvLineState | null; // CSV only
  lineNo: number;
  carry: Buffer | null; // start of a line that continues in the next chunk
  skipping: boolean; // inside an over-long line, waiting for its end
}

/** One line b[s..e) without its "\n": counted, its "\r" dropped, blank lines skipped, the rest parsed. */
function takeLine(r: LineReader, b: Uint8Array, s: number, e: number): void {
  const lineNo = ++r.lineNo;
  if (e > s && b[e - 1] === 13) e--;
  if (e === s) return; // blank line: not a record
  if (r.isd !== null) parseIsdLine(r.isd, b, s, e, lineNo);
  else if (r.csv !== null) parseCsvLine(r.file, r.csv, b, s, e, lineNo);
  else parseLiteLine(r.file, r.liteStation, b, s, e, lineNo);
}

/** Passes every complete line of chunk[from..] on; returns where the unfinished last line starts. */
function takeLines(r: LineReader, chunk: Buffer, from: number): number {
  let pos = from;
  for (let nl = chunk.indexOf(10, pos); nl >= 0; nl = chunk.indexOf(10, pos)) {
    takeLine(r, chunk, pos, nl);
    pos = nl + 1;
  }
  return pos;
}

/**
 * A line reader for a file of the given layout. Throws InputError for an ISD-Lite file whose station is
 * known neither from its name nor from the options.
 */
export function createLineReader(file: ParsedFile, format: ClimateFormat, options: ReadOptions): LineReader {
  const r: LineReader = {
    file,
    isd: null,
    liteStation: -1,
    csv: null,
    lineNo: 0,
    carry: null,
    skipping: false,
  };
  if (format === "isd") r.isd = createIsdLineState(file);
  else if (format === "csv") r.csv = { columns: null };
  else {
    const id = options.stationIdOverride ?? stationIdFromFileName(basename(file.path));
    if (id === null)
      throw inputError(
        file.path,
        undefined,
        "station id",
        "ISD-Lite file name does not start with USAF-WBAN (e.g. 725300-94846-2014); give the station id as an option",
      );
    r.liteStation = file.stations.length;
    file.stations.push(id);
    file.stationNames.push(null);
    file.callLetters.push(new Map());
  }
  return r;
}

/** Parses the lines of the next chunk of the file's bytes (a line may run on into the next chunk). */
export function feedLines(r: LineReader, chunk: Buffer): void {
  r.file.bytes += chunk.length;
  let pos = 0;
  if (r.carry !== null || r.skipping) {
    const nl = chunk.indexOf(10);
    if (nl < 0) {
      if (!r.skipping) {
        r.carry = Buffer.concat([r.carry!, chunk]);
        if (r.carry.length > MAX_LINE_BYTES) {
          r.skipping = true;
          r.carry = null;
        }
      }
      return;
    }
    if (r.skipping) {
      tooLong(r.file, ++r.lineNo);
      r.skipping = false;
    } else {
      const joined: Buffer = Buffer.concat([r.carry!, chunk.subarray(0, nl)]);
      takeLine(r, joined, 0, joined.length);
    }
    r.carry = null;
    pos = nl + 1;
  }
  pos = takeLines(r, chunk, pos);
  if (pos < chunk.length) {
    if (chunk.length - pos > MAX_LINE_BYTES) r.skipping = true;
    else r.carry = Buffer.from(chunk.subarray(pos));
  }
}

/** Ends the file: its last line (without a final line break) and the call-letter counts. */
export function finishLines(r: LineReader): void {
  if (r.skipping) tooLong(r.file, ++r.lineNo);
  else if (r.carry !== null) takeLine(r, r.carry, 0, r.carry.length);
  r.carry = null;
  r.skipping = false;
  if (r.isd !== null) flushCalls(r.isd);
  if (r.csv !== null && r.csv.columns === null)
    throw inputError(r.file.path, 1, undefined, "CSV without a header row");
  r.file.lines = r.lineNo;
}

/** Streams the lines of a file from byte chunks to the line parser of its layout. */
async function readLines(
  file: ParsedFile,
  head: Buffer,
  rest: AsyncGenerator<Buffer> | null,
  format: ClimateFormat,
  options: ReadOptions,
): Promise<void> {
  const r = createLineReader(file, format, options);
  for (let chunk: Buffer | null = head; chunk !== null; chunk = await nextChunk(rest)) feedLines(r, chunk);
  finishLines(r);
}

/**
 * Files expected to hold at least this many records (some 25 MB of ISD text) are parsed on a worker
 * thread while this thread decompresses them; smaller ones are not worth the hand-over.
 */
export const PARSE_WORKER_MIN_RECORDS = 100_000;

/** readLines with the parsing done on a worker thread (see startParseSession). */
async function readLinesOnWorker(
  path: string,
  head: Buffer,
  rest: AsyncGenerator<Buffer> | null,
  format: ClimateFormat,
  options: ReadOptions,
  capacity: number,
): Promise<ParsedFile> {
  const session = startParseSession(path, format, options, capacity);
  try {
    for (let chunk: Buffer | null = head; chunk !== null; chunk = await nextChunk(rest))
      await session.send(chunk);
  } catch (err) {
    session.abort();
    throw err;
  }
  return session.finish();
}

/** The next chunk of the stream, or null at its end (or when there is no stream). */
async function nextChunk(rest: AsyncGenerator<Buffer> | null): Promise<Buffer | null> {
  if (rest === null) return null;
  const r = await rest.next();
  return r.done ? null : r.value;
}

function tooLong(file: ParsedFile, lineNo: number): void {
  pushMalformed(file.records, UNKNOWN_STATION, lineNo);
  noteMalformed(file, lineNo, "length", `line longer than ${MAX_LINE_BYTES} bytes (not a climate record)`);
}
