/**
 * Reads a calibration capture from CSV or TSV into a ColumnTable of canonical fields,
 * validating as it goes and naming the row and column of the first problem.
 *
 * Rows are numbered as lines of the file, the header being row 1, so that a technician can
 * find them in any editor (a quoted cell spanning two lines would shift the count; loggers
 * do not write those). Only recognised columns are read as numbers; others are ignored and
 * listed. Values keep the units they were written in: the unit hints read from column
 * names are returned beside the table for the analysis to apply.
 */
import { Readable } from "node:stream";
import { StringDecoder } from "node:string_decoder";
import Papa from "papaparse";
import { recogniseColumns, sensorsInFields, type ColumnRecognition } from "@/geometry/column-names";
import type { CaptureField, ColumnTable } from "@/geometry/types";
import type { UnitSpec } from "@/geometry/units";
import { parseNumber, readNumericLine, suitsFastLane } from "@/lib/ingest/numeric-lines";

/** A file that cannot be read, with where the problem is (1-based line number, column name). */
export class IngestError extends Error {
  readonly row: number | null;
  readonly column: string | null;

  constructor(row: number | null, column: string | null, message: string) {
    const where = [row !== null ? `row ${row}` : null, column !== null ? `column "${column}"` : null].filter(Boolean).join(", ");
    super(where ? `${where}: ${message}` : message);
    this.name = "IngestError";
    this.row = row;
    this.column = column;
  }
}

export interface IngestOptions {
  /** Column name → canonical field or "ignore", overriding recognition (the `--map` option). */
  map?: Record<string, CaptureField | "ignore">;
  /** Fewest data rows accepted; default 10. */
  minRows?: number;
  /** Refuse a file without a time column; default true. */
  requireTime?: boolean;
  /** Most data rows accepted; default unlimited. */
  maxRows?: number;
  /** Most columns in the header; default unlimited. */
  maxColumns?: number;
}

export interface IngestedCapture {
  table: ColumnTable;
  recognition: ColumnRecognition;
  /** Canonical field → unit read from its column name. */
  unitHints: Record<CaptureField, UnitSpec>;
  delimiter: string;
  /** Columns of the file that were not read. */
  ignoredColumns: string[];
  /** Things worth saying that did not stop the read (a column claimed twice, …). */
  notes: string[];
}

const DELIMITERS = [",", "\t", ";", "|"] as const;
const DELIMITER_NAMES: Record<string, string> = { ",": "comma", "\t": "tab", ";": "semicolon", "|": "vertical bar" };
const DEFAULT_MIN_ROWS = 10;
/** Rows per storage block of a column while reading (512 KiB of numbers). */
const BLOCK_ROWS = 65_536;
/** Enough text to see the header and a few rows when guessing the delimiter. */
const PEEK_CHARS = 64 * 1024;

function isSkippableLine(line: string): boolean {
  const trimmed = line.trim();
  return trimmed === "" || trimmed.startsWith("#");
}

/**
 * Picks the delimiter that splits the header into more than one field and most of the first
 * data lines into as many (one bad line must not hide the delimiter, so that the bad line is
 * what gets reported); among those, the one giving most fields. Null when none does.
 */
export function detectDelimiter(head: string): string | null {
  const lines = head.split(/\r\n|\n|\r/).filter((line) => !isSkippableLine(line));
  if (lines.length === 0) return null;
  // The last line of a peek may be cut short.
  const data = lines.slice(1, lines.length > 2 ? Math.min(lines.length - 1, 21) : lines.length);
  let best: { delimiter: string; agreeing: number; fields: number } | null = null;
  for (const delimiter of DELIMITERS) {
    const fields = lines[0].split(delimiter).length;
    if (fields < 2) continue;
    const agreeing = data.filter((line) => {
      const count = line.split(delimiter).length;
      return count === fields || (count === fields + 1 && line.trimEnd().endsWith(delimiter));
    }).length;
    if (agreeing * 2 < data.length) continue;
    if (!best || agreeing > best.agreeing || (agreeing === best.agreeing && fields > best.fields)) {
      best = { delimiter, agreeing, fields };
    }
  }
  return best?.delimiter ?? null;
}

/** Collects validated rows into growing columns; one per parse. */
class TableBuilder {
  private row = 0;
  private header: string[] | null = null;
  private recognition: ColumnRecognition | null = null;
  /**
   * Each column is kept as fixed blocks, so growing never copies what was read and the
   * final column is the only copy made: the peak is about twice the numbers read.
   */
  private readers: { index: number; field: CaptureField; header: string; blocks: Float64Array[] }[] = [];
  private timeReader: number = -1;
  private previousTime = Number.NEGATIVE_INFINITY;
  private length = 0;
  private readonly notes: string[] = [];
  /** The fast lane's view of the readers: their column indices, and a row of their values. */
  private wanted = new Int32Array(0);
  private values = new Float64Array(0);
  /** The block each reader is filling (the last of its blocks). */
  private currentBlocks: Float64Array[] = [];

  constructor(
    private readonly options: IngestOptions,
    private readonly delimiter: string,
  ) {}

  addRows(rows: string[][]): void {
    for (const cells of rows) {
      this.row += 1;
      // A comment is a line starting with "#", whatever it holds (detectDelimiter reads it so too).
      if ((cells.length === 1 && isSkippableLine(cells[0])) || cells[0].trimStart().startsWith("#")) continue;
      if (this.header === null) this.readHeader(cells);
      else this.readData(cells);
    }
  }

  /**
   * One line of the file as bytes[start, end), without its line ending (the fast lane; the
   * file has no quotes). Plain numeric rows are stored straight from the bytes; everything
   * else (the header, comments, blank lines, a row with a problem) is read as text, the way
   * addRows reads it, so that the messages are the same.
   */
  addLineBytes(bytes: Uint8Array, start: number, end: number, delimiterCode: number): void {
    this.row += 1;
    if (this.header !== null && readNumericLine(bytes, start, end, delimiterCode, this.header.length, this.wanted, this.values)) {
      this.storeValues(this.values);
      return;
    }
    const line = Buffer.from(bytes.buffer, bytes.byteOffset + start, end - start).toString("utf8");
    if (isSkippableLine(line)) return;
    const cells = line.split(this.delimiter);
    if (this.header === null) this.readHeader(cells);
    else this.readData(cells);
  }

  /** A row whose wanted cells are all numbers, in reader order: the checks of readData that remain, then storage. */
  private storeValues(values: Float64Array): void {
    if (this.options.maxRows !== undefined && this.length >= this.options.maxRows) {
      throw new IngestError(this.row, null, `more than ${this.options.maxRows} data rows; split the capture into smaller files`);
    }
    const at = this.openBlocks();
    if (this.timeReader >= 0) {
      const time = values[this.timeReader];
      if (time < this.previousTime) {
        throw new IngestError(
          this.row,
          this.readers[this.timeReader].header,
          `time goes backwards (${time} after ${this.previousTime}); rows must be in time order`,
        );
      }
      this.previousTime = time;
    }
    const blocks = this.currentBlocks;
    for (let r = 0; r < blocks.length; r++) blocks[r][at] = values[r];
    this.length += 1;
  }

  /** The row's place in the current blocks, opening a new block per reader when the last is full. */
  private openBlocks(): number {
    const at = this.length % BLOCK_ROWS;
    if (at === 0) {
      this.currentBlocks = this.readers.map((reader) => {
        const block = new Float64Array(BLOCK_ROWS);
        reader.blocks.push(block);
        return block;
      });
    }
    return at;
  }

  private readHeader(cells: string[]): void {
    if (cells.length < 2) {
      throw new IngestError(
        this.row,
        null,
        `the header "${cells[0].slice(0, 80)}" is a single column: the delimiter was not recognised; separate columns with commas, tabs or semicolons`,
      );
    }
    if (this.options.maxColumns !== undefined && cells.length > this.options.maxColumns) {
      throw new IngestError(this.row, null, `the header has ${cells.length} columns; at most ${this.options.maxColumns} are accepted`);
    }
    this.header = cells.map((cell) => cell.trim());
    const recognition = recogniseColumns(this.header, this.options.map);
    this.recognition = recognition;
    for (const conflict of recognition.conflicts) {
      this.notes.push(`${conflict.field} is named by ${conflict.headers.map((h) => `"${h}"`).join(" and ")}; the first was read`);
    }
    for (const { sensor, missing } of recognition.incompleteSensors) {
      throw new IngestError(this.row, missing[0], `missing required column: ${sensor} has no ${missing.join(", ")} column`);
    }
    const sensors = sensorsInFields(Object.keys(recognition.fieldIndex));
    if (sensors.mag.length === 0 && sensors.accel.length === 0 && sensors.gyro.length === 0) {
      throw new IngestError(
        this.row,
        null,
        `missing required columns: no magnetometer, accelerometer or gyroscope columns recognised among ${this.header.map((h) => `"${h}"`).join(", ")}; name them like mag_x or accel_x, or map them with --map column=compass_a.x`,
      );
    }
    if ((this.options.requireTime ?? true) && !("time" in recognition.fieldIndex)) {
      throw new IngestError(
        this.row,
        "time",
        "missing required column: no time column recognised; name it time, timestamp, time_ms or time_us, or map one with --map column=time",
      );
    }
    for (const [field, index] of Object.entries(recognition.fieldIndex)) {
      this.readers.push({ index, field, header: this.header[index], blocks: [] });
    }
    this.readers.sort((a, b) => a.index - b.index);
    this.timeReader = this.readers.findIndex((reader) => reader.field === "time");
    this.wanted = Int32Array.from(this.readers, (reader) => reader.index);
    this.values = new Float64Array(this.readers.length);
  }

  private readData(cells: string[]): void {
    const width = this.header!.length;
    if (cells.length !== width) {
      const onlyTrailingBlanks = cells.length > width && cells.slice(width).every((cell) => cell.trim() === "");
      if (!onlyTrailingBlanks) {
        const hint = cells.length === 1 ? ` (is this row separated by something other than a ${DELIMITER_NAMES[this.delimiter]}?)` : "";
        throw new IngestError(this.row, null, `${cells.length} values where the header has ${width} columns${hint}`);
      }
    }
    if (this.options.maxRows !== undefined && this.length >= this.options.maxRows) {
      throw new IngestError(this.row, null, `more than ${this.options.maxRows} data rows; split the capture into smaller files`);
    }
    const at = this.openBlocks();
    for (let r = 0; r < this.readers.length; r++) {
      const reader = this.readers[r];
      const cell = cells[reader.index];
      const value = parseNumber(cell);
      if (!Number.isFinite(value)) throw new IngestError(this.row, reader.header, describeBadCell(cell));
      reader.blocks[reader.blocks.length - 1][at] = value;
      if (r === this.timeReader) {
        if (value < this.previousTime) {
          throw new IngestError(
            this.row,
            reader.header,
            `time goes backwards (${value} after ${this.previousTime}); rows must be in time order`,
          );
        }
        this.previousTime = value;
      }
    }
    this.length += 1;
  }

  finish(): IngestedCapture {
    if (this.header === null || this.recognition === null) throw new IngestError(null, null, "the file is empty: no header row");
    const minRows = this.options.minRows ?? DEFAULT_MIN_ROWS;
    if (this.length < minRows) {
      throw new IngestError(null, null, `too few samples: ${this.length} data rows, at least ${minRows} are needed`);
    }
    const columns: Record<CaptureField, Float64Array> = {};
    for (const reader of this.readers) {
      const column = new Float64Array(this.length);
      reader.blocks.forEach((block, b) => {
        const start = b * BLOCK_ROWS;
        column.set(start + BLOCK_ROWS <= this.length ? block : block.subarray(0, this.length - start), start);
      });
      reader.blocks = [];
      columns[reader.field] = column;
    }
    const fields = this.readers.map((reader) => reader.field);
    return {
      table: { fields, columns, length: this.length },
      recognition: this.recognition,
      unitHints: this.recognition.unitHints,
      delimiter: this.delimiter,
      ignoredColumns: this.recognition.columns.filter((column) => column.field === null).map((column) => column.header),
      notes: this.notes,
    };
  }
}

function describeBadCell(cell: string | undefined): string {
  const trimmed = (cell ?? "").trim();
  if (trimmed === "") return "empty cell where a number is needed";
  if (/^[+-]?(nan|inf|infinity)$/i.test(trimmed)) return `"${trimmed}" is not a finite number`;
  if (/^[+-]?\d+,\d+$/.test(trimmed)) return `"${trimmed}" uses a decimal comma; write decimals with a point`;
  return `"${trimmed.slice(0, 40)}" is text where a number is needed`;
}

function stripBom(text: string): string {
  return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
}

function delimiterOrThrow(head: string): string {
  const delimiter = detectDelimiter(head);
  if (delimiter !== null) return delimiter;
  const firstLine = head.split(/\r\n|\n|\r/).find((line) => !isSkippableLine(line));
  if (firstLine === undefined) throw new IngestError(null, null, "the file is empty: no header row");
  const lines = head.split(/\r\n|\n|\r/);
  const headerRow = lines.indexOf(firstLine) + 1;
  throw new IngestError(
    headerRow,
    null,
    `cannot tell how columns are separated: no comma, tab, semicolon or vertical bar splits the header "${firstLine.slice(0, 80)}" and the rows below it into the same number of columns`,
  );
}

/**
 * The column names of a file from the head of its text (the first tens of kilobytes are
 * plenty), split with the delimiter the full reader would pick and trimmed as it trims them.
 * Null when no header line or no delimiter can be found: the full read says why.
 */
export function readHeaderCells(head: string): string[] | null {
  const text = stripBom(head);
  const delimiter = detectDelimiter(text.slice(0, PEEK_CHARS));
  if (delimiter === null) return null;
  const line = text.split(/\r\n|\n|\r/).find((candidate) => !isSkippableLine(candidate));
  if (line === undefined) return null;
  const cells = Papa.parse<string[]>(line, { delimiter, skipEmptyLines: false }).data[0] ?? [];
  return cells.length >= 2 ? cells.map((cell) => cell.trim()) : null;
}

/** The chunked form of Papa.parse, which its typings only declare for files and downloads. */
interface ChunkedParseConfig {
  delimiter: string;
  skipEmptyLines: false;
  chunkSize?: number;
  chunk(results: Papa.ParseResult<string[]>, parser: Papa.Parser): void;
  complete?(): void;
  error?(error: Error): void;
}
const parseChunked = Papa.parse as unknown as (input: string | NodeJS.ReadableStream, config: ChunkedParseConfig) => void;

/** Parses a whole CSV/TSV text. Throws IngestError on the first problem. */
export function parseCsvTable(text: string, options: IngestOptions = {}): IngestedCapture {
  const body = stripBom(text);
  const delimiter = delimiterOrThrow(body.slice(0, PEEK_CHARS));
  const builder = new TableBuilder(options, delimiter);
  let failure: unknown = null;
  parseChunked(body, {
    delimiter,
    skipEmptyLines: false,
    chunkSize: 1024 * 1024,
    chunk: (results, parser) => {
      try {
        builder.addRows(results.data);
      } catch (error) {
        failure = error;
        parser.abort();
      }
    },
  });
  if (failure) throw failure;
  return builder.finish();
}

const asBuffer = (chunk: string | Uint8Array): Buffer =>
  typeof chunk === "string" ? Buffer.from(chunk, "utf8") : Buffer.from(chunk.buffer, chunk.byteOffset, chunk.byteLength);

const plainBytes = (buffer: Buffer): Uint8Array => new Uint8Array(buffer.buffer, buffer.byteOffset, buffer.length);

/** Feeds complete lines of byte chunks to the builder, carrying a line split across chunks. */
class LineSplitter {
  private carry: Buffer | null = null;

  constructor(
    private readonly builder: TableBuilder,
    private readonly delimiterCode: number,
  ) {}

  private line(bytes: Uint8Array, start: number, newline: number): void {
    const end = newline > start && bytes[newline - 1] === 0x0d ? newline - 1 : newline;
    this.builder.addLineBytes(bytes, start, end, this.delimiterCode);
  }

  feed(chunk: Buffer): void {
    // Read through a plain Uint8Array view: element loads on it compile to simpler code than on a Buffer.
    const bytes = plainBytes(chunk);
    let position = 0;
    if (this.carry) {
      const newline = bytes.indexOf(0x0a);
      if (newline < 0) {
        this.carry = Buffer.concat([this.carry, bytes]);
        return;
      }
      const joined = plainBytes(Buffer.concat([this.carry, bytes.subarray(0, newline + 1)]));
      this.carry = null;
      this.line(joined, 0, joined.length - 1);
      position = newline + 1;
    }
    for (;;) {
      const newline = bytes.indexOf(0x0a, position);
      if (newline < 0) break;
      this.line(bytes, position, newline);
      position = newline + 1;
    }
    // Copied, so that a short tail does not keep its whole chunk alive.
    if (position < bytes.length) this.carry = Buffer.from(bytes.subarray(position));
  }

  end(): void {
    if (this.carry) this.line(plainBytes(this.carry), 0, this.carry.length);
    this.carry = null;
  }
}

/**
 * Parses CSV/TSV from a stream (an upload, a file) chunk by chunk: memory holds one chunk of
 * text and the growing numeric columns, never the text of the whole file. Rejects with an
 * IngestError on the first problem and stops reading.
 *
 * A file without quotes (as loggers write them) is read line by line from the bytes, numbers
 * straight from them (numeric-lines.ts); one with quotes goes through the CSV parser.
 */
export async function parseCsvStream(input: Readable, options: IngestOptions = {}): Promise<IngestedCapture> {
  const iterator = input[Symbol.asyncIterator]() as AsyncIterator<string | Uint8Array>;
  const headChunks: Buffer[] = [];
  let headSize = 0;
  let ended = false;
  while (headSize < PEEK_CHARS) {
    const next = await iterator.next();
    if (next.done) {
      ended = true;
      break;
    }
    const chunk = asBuffer(next.value);
    headChunks.push(chunk);
    headSize += chunk.length;
  }
  let headBytes = Buffer.concat(headChunks);
  if (headBytes[0] === 0xef && headBytes[1] === 0xbb && headBytes[2] === 0xbf) headBytes = headBytes.subarray(3);
  // A multi-byte character cut at the end of the peek decodes as a replacement: harmless here.
  const head = headBytes.toString("utf8");
  let delimiter: string;
  try {
    delimiter = delimiterOrThrow(head);
  } catch (error) {
    input.destroy();
    throw error;
  }
  const builder = new TableBuilder(options, delimiter);

  if (suitsFastLane(head)) {
    const splitter = new LineSplitter(builder, delimiter.charCodeAt(0));
    try {
      splitter.feed(headBytes);
      if (!ended) {
        for (;;) {
          const next = await iterator.next();
          if (next.done) break;
          splitter.feed(asBuffer(next.value));
        }
      }
      splitter.end();
      return builder.finish();
    } catch (error) {
      input.destroy();
      throw error;
    }
  }

  const decoder = new StringDecoder("utf8");
  async function* remainder(): AsyncGenerator<string> {
    yield decoder.write(headBytes);
    if (!ended) {
      for (;;) {
        const next = await iterator.next();
        if (next.done) break;
        yield decoder.write(asBuffer(next.value));
      }
    }
    const rest = decoder.end();
    if (rest) yield rest;
  }
  const source = Readable.from(remainder(), { objectMode: true });

  return new Promise<IngestedCapture>((resolve, reject) => {
    let failure: unknown = null;
    parseChunked(source, {
      delimiter,
      skipEmptyLines: false,
      chunk: (results, parser) => {
        if (failure) return;
        try {
          builder.addRows(results.data);
        } catch (error) {
          failure = error;
          parser.abort();
          source.destroy();
          input.destroy();
        }
      },
      complete: () => {
        if (failure) return reject(failure);
        try {
          resolve(builder.finish());
        } catch (error) {
          reject(error);
        }
      },
      error: (error: Error) => reject(failure ?? error),
    });
  });
}
