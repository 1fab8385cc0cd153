import { Readable } from "node:stream";
import { describe, expect, test } from "vitest";
import { detectDelimiter, IngestError, parseCsvStream, parseCsvTable, readHeaderCells } from "@/lib/ingest/csv-table";

/** A small valid capture: a header and `rows` rows of time, one magnetometer and one accelerometer. */
function goodCsv(rows = 12, delimiter = ","): string {
  const lines = [["time_ms", "mag_x (uT)", "mag_y (uT)", "mag_z (uT)", "ax", "ay", "az", "note"].join(delimiter)];
  for (let i = 0; i < rows; i++) {
    lines.push([i * 10, 20 + i, -3.5, 44.25, 0.01, -0.02, -9.81, "ok"].join(delimiter));
  }
  return lines.join("\n") + "\n";
}

function withCell(csv: string, row: number, column: number, value: string): string {
  const lines = csv.split("\n");
  const cells = lines[row - 1].split(",");
  cells[column] = value;
  lines[row - 1] = cells.join(",");
  return lines.join("\n");
}

function streamOf(text: string, chunkSize = 7): Readable {
  const chunks: Buffer[] = [];
  const bytes = Buffer.from(text, "utf8");
  for (let i = 0; i < bytes.length; i += chunkSize) chunks.push(bytes.subarray(i, i + chunkSize));
  return Readable.from(chunks);
}

function catchIngest(run: () => unknown): IngestError {
  try {
    run();
  } catch (error) {
    if (error instanceof IngestError) return error;
    throw error;
  }
  throw new Error("expected an IngestError");
}

async function catchIngestAsync(run: () => Promise<unknown>): Promise<IngestError> {
  try {
    await run();
  } catch (error) {
    if (error instanceof IngestError) return error;
    throw error;
  }
  throw new Error("expected an IngestError");
}

describe("detectDelimiter", () => {
  test.each([
    { label: "comma", text: "a,b,c\n1,2,3\n4,5,6\n", delimiter: "," },
    { label: "tab", text: "a\tb\tc\n1\t2\t3\n", delimiter: "\t" },
    { label: "semicolon with decimal commas", text: "a;b\n1,5;2,5\n3,5;4,0\n", delimiter: ";" },
    { label: "comment preamble", text: "# logger v2\n\na|b\n1|2\n", delimiter: "|" },
    { label: "spaces only", text: "a b c\n1 2 3\n", delimiter: null },
  ])("$label", ({ text, delimiter }) => {
    expect(detectDelimiter(text)).toBe(delimiter);
  });
});

describe("readHeaderCells", () => {
  test.each([
    {
      label: "comma, with a byte-order mark",
      text: "\ufefftime, mag_x ,mag_y,mag_z,current\n0,1,2,3,4\n",
      cells: ["time", "mag_x", "mag_y", "mag_z", "current"],
    },
    { label: "tab", text: "t\tmx\tmy\tmz\tThrottle (%)\n0\t1\t2\t3\t40\n", cells: ["t", "mx", "my", "mz", "Throttle (%)"] },
    {
      label: "comment preamble and a quoted name",
      text: '# logger v2\n\nt;"Battery Current (A)";mx\n1;2;3\n',
      cells: ["t", "Battery Current (A)", "mx"],
    },
    // The head of a file is cut anywhere: the last line may be short.
    { label: "a head cut inside a row", text: "time,mx,my,mz\n0,1,2,3\n1,2,3,4\n2,3,", cells: ["time", "mx", "my", "mz"] },
    { label: "only a header line", text: "time,mx,my,mz", cells: ["time", "mx", "my", "mz"] },
    { label: "no delimiter", text: "time mx my mz\n0 1 2 3\n", cells: null },
    { label: "nothing but comments", text: "# nothing\n\n", cells: null },
  ])("$label", ({ text, cells }) => {
    expect(readHeaderCells(text)).toEqual(cells);
  });
});

describe("parseCsvTable", () => {
  test("reads recognised columns as numbers and keeps units as hints", () => {
    const result = parseCsvTable(goodCsv());
    expect(result.table.length).toBe(12);
    expect(result.table.fields).toEqual(["time", "compass_a.x", "compass_a.y", "compass_a.z", "accel_a.x", "accel_a.y", "accel_a.z"]);
    expect(Array.from(result.table.columns["compass_a.x"].slice(0, 3))).toEqual([20, 21, 22]);
    expect(result.table.columns.time[11]).toBe(110);
    expect(result.unitHints["compass_a.x"].unit).toBe("uT");
    expect(result.unitHints.time.unit).toBe("ms");
    expect(result.ignoredColumns).toEqual(["note"]);
    expect(result.delimiter).toBe(",");
  });

  test.each([
    { label: "tab-separated", delimiter: "\t" },
    { label: "semicolon-separated", delimiter: ";" },
  ])("$label files read the same", ({ delimiter }) => {
    const result = parseCsvTable(goodCsv(12, delimiter));
    expect(result.table.columns["compass_a.z"][5]).toBe(44.25);
    expect(result.delimiter).toBe(delimiter);
  });

  test("a byte-order mark, comment lines and blank lines are skipped without shifting row numbers", () => {
    const csv = "\ufeff# exported by a logger\n" + goodCsv().replace("\n", "\n\n");
    const result = parseCsvTable(csv);
    expect(result.table.length).toBe(12);
    // Row numbers still count the skipped lines: header on line 2, blank line 3, data from line 4.
    const broken = csv.split("\n");
    broken[4] = broken[4].replace("-3.5", "abc");
    const error = catchIngest(() => parseCsvTable(broken.join("\n")));
    expect(error.row).toBe(5);
    expect(error.column).toBe("mag_y (uT)");
  });

  test("the column map overrides names", () => {
    const result = parseCsvTable(goodCsv(), { map: { ax: "gyro_a.x", ay: "gyro_a.y", AZ: "gyro_a.z" } });
    expect(result.table.fields).toEqual(["time", "compass_a.x", "compass_a.y", "compass_a.z", "gyro_a.x", "gyro_a.y", "gyro_a.z"]);
  });

  // Each bad file names its row (line of the file, header = 1) and column.
  test.each([
    {
      label: "text in a number column",
      edit: (csv: string) => withCell(csv, 4, 1, "twelve"),
      row: 4,
      column: "mag_x (uT)",
      message: /text where a number is needed/,
    },
    { label: "empty cell", edit: (csv: string) => withCell(csv, 6, 5, ""), row: 6, column: "ay", message: /empty cell/ },
    { label: "NaN", edit: (csv: string) => withCell(csv, 3, 3, "NaN"), row: 3, column: "mag_z (uT)", message: /not a finite number/ },
    { label: "Infinity", edit: (csv: string) => withCell(csv, 9, 6, "-Infinity"), row: 9, column: "az", message: /not a finite number/ },
    { label: "decimal comma", edit: (csv: string) => withCell(csv, 2, 4, '"0,5"'), row: 2, column: "ax", message: /decimal comma/ },
    {
      label: "time going backwards",
      edit: (csv: string) => withCell(csv, 7, 0, "5"),
      row: 7,
      column: "time_ms",
      message: /time goes backwards/,
    },
    {
      label: "short row",
      edit: (csv: string) =>
        csv
          .split("\n")
          .map((l, i) => (i === 4 ? l.split(",").slice(0, 5).join(",") : l))
          .join("\n"),
      row: 5,
      column: null,
      message: /5 values where the header has 8 columns/,
    },
    {
      label: "missing axis",
      edit: (csv: string) => csv.replace("az", "temperature"),
      row: 1,
      column: "accel_a.z",
      message: /missing required column/,
    },
    { label: "no time column", edit: (csv: string) => csv.replace("time_ms", "index"), row: 1, column: "time", message: /no time column/ },
    {
      label: "no sensor column",
      edit: () => "time,temp\n" + "1,2\n".repeat(20),
      row: 1,
      column: null,
      message: /no magnetometer, accelerometer or gyroscope/,
    },
    {
      label: "wrong delimiter",
      edit: (csv: string) => csv.replace(/,/g, " "),
      row: 1,
      column: null,
      message: /cannot tell how columns are separated/,
    },
    {
      label: "a row with another delimiter",
      edit: (csv: string) =>
        csv
          .split("\n")
          .map((l, i) => (i === 8 ? l.replace(/,/g, ";") : l))
          .join("\n"),
      row: 9,
      column: null,
      message: /something other than a comma/,
    },
    { label: "too few samples", edit: () => goodCsv(4), row: null, column: null, message: /too few samples: 4 data rows/ },
    { label: "empty file", edit: () => "", row: null, column: null, message: /empty/ },
  ])("$label", ({ edit, row, column, message }) => {
    const error = catchIngest(() => parseCsvTable(edit(goodCsv())));
    expect(error.row).toBe(row);
    expect(error.column).toBe(column);
    expect(error.message).toMatch(message);
    if (row !== null) expect(error.message).toContain(`row ${row}`);
    if (column !== null) expect(error.message).toContain(`column "${column}"`);
  });

  test("trailing empty cells from a trailing delimiter are accepted", () => {
    const csv = goodCsv()
      .split("\n")
      .map((line, i) => (i > 0 && line ? line + "," : line))
      .join("\n");
    expect(parseCsvTable(csv).table.length).toBe(12);
  });
});

describe("parseCsvStream", () => {
  test("gives the same table as the string parser, in small chunks", async () => {
    const text = goodCsv(500);
    const fromString = parseCsvTable(text);
    const fromStream = await parseCsvStream(streamOf(text, 13));
    expect(fromStream.table.fields).toEqual(fromString.table.fields);
    for (const field of fromString.table.fields) {
      expect(Array.from(fromStream.table.columns[field])).toEqual(Array.from(fromString.table.columns[field]));
    }
  });

  test("columns longer than one storage block (65,536 rows) come back whole and in order", async () => {
    const text = goodCsv(70_000);
    const result = await parseCsvStream(streamOf(text, 64 * 1024));
    expect(result.table.length).toBe(70_000);
    const time = result.table.columns.time;
    expect(time[65_535]).toBe(655_350);
    expect(time[65_536]).toBe(655_360);
    expect(time[69_999]).toBe(699_990);
    expect(result.table.columns["compass_a.x"][69_999]).toBe(20 + 69_999);
  });

  test("a multi-byte character split across chunks survives", async () => {
    const text = goodCsv().replace("mag_x (uT)", "mag_x (µT)");
    const result = await parseCsvStream(streamOf(text, 17));
    expect(result.unitHints["compass_a.x"].unit).toBe("uT");
  });

  test.each([
    { label: "text far into a long file", at: 3000, row: 3001, column: "mag_y (uT)" },
    { label: "text in the first row", at: 1, row: 2, column: "mag_y (uT)" },
  ])("names the row of a bad cell: $label", async ({ at, row, column }) => {
    const lines = goodCsv(4000).split("\n");
    lines[at] = lines[at].replace("-3.5", "x1");
    const error = await catchIngestAsync(() => parseCsvStream(streamOf(lines.join("\n"), 4096)));
    expect(error.row).toBe(row);
    expect(error.column).toBe(column);
  });

  test("wrong delimiter in a stream", async () => {
    const error = await catchIngestAsync(() => parseCsvStream(streamOf(goodCsv().replace(/,/g, " "))));
    expect(error.row).toBe(1);
    expect(error.message).toMatch(/cannot tell how columns are separated/);
  });

  test("too few samples in a stream", async () => {
    const error = await catchIngestAsync(() => parseCsvStream(streamOf(goodCsv(3))));
    expect(error.message).toMatch(/too few samples/);
  });
});

describe("limits on rows and columns", () => {
  const header = "time,mag_x,mag_y,mag_z";
  const body = Array.from({ length: 30 }, (_, i) => `${i},${i},${i + 1},${i + 2}`).join("\n");
  test.each([
    ["one row too many", { maxRows: 29 }, /more than 29 data rows/, 31],
    ["too many columns", { maxColumns: 3 }, /4 columns; at most 3/, 1],
  ])("%s is refused with its row", (_label, limits, message, row) => {
    try {
      parseCsvTable(`${header}\n${body}\n`, limits);
      throw new Error("expected an IngestError");
    } catch (error) {
      expect(error).toBeInstanceOf(IngestError);
      expect((error as IngestError).message).toMatch(message);
      expect((error as IngestError).row).toBe(row);
    }
  });
  test("exactly at the limits is accepted", () => {
    expect(parseCsvTable(`${header}\n${body}\n`, { maxRows: 30, maxColumns: 4 }).table.length).toBe(30);
  });
});
