import { Readable } from "node:stream";
import fc from "fast-check";
import { describe, expect, test } from "vitest";
import { IngestError, parseCsvStream, parseCsvTable } from "@/lib/ingest/csv-table";
import { parseDecimalBytes, readNumericLine, suitsFastLane } from "@/lib/ingest/numeric-lines";

const bytesOf = (text: string) => Buffer.from(text, "latin1");
const parse = (text: string) => parseDecimalBytes(bytesOf(text), 0, text.length);

function streamOf(text: string, chunkSize: number): Readable {
  const bytes = Buffer.from(text, "utf8");
  const chunks: Buffer[] = [];
  for (let i = 0; i < bytes.length; i += chunkSize) chunks.push(bytes.subarray(i, i + chunkSize));
  return Readable.from(chunks);
}

describe("parseDecimalBytes", () => {
  test("gives the same double as Number() for decimals of up to 15 digits (property)", () => {
    fc.assert(
      fc.property(
        fc.constantFrom("", "-", "+"),
        fc.stringMatching(/^[0-9]{1,8}$/),
        fc.option(fc.stringMatching(/^[0-9]{0,7}$/), { nil: undefined }),
        (sign, whole, fraction) => {
          const text = `${sign}${whole}${fraction === undefined ? "" : `.${fraction}`}`;
          expect(Object.is(parse(text), Number(text))).toBe(true);
        },
      ),
      { numRuns: 5000 },
    );
  });

  test("doubles printed by JavaScript with three decimals read back exactly", () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), (v) => {
        const text = v.toFixed(3);
        expect(parse(text)).toBe(Number(text));
      }),
      { numRuns: 5000 },
    );
  });

  test.each([
    " 12.5 ",
    "\t-3",
    ".5",
    "7.",
    "+0.25",
    "1e5",
    "-2.5E-3",
    "1.e5",
    "1234567890123456",
    "-9.780940505564887",
    "0.00021862356757452297",
  ])("takes %j, as Number() reads it", (text) => {
    expect(parse(text)).toBe(Number(text.trim()));
  });

  test("full-precision doubles come back exactly (property)", () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (v) => {
        const text = String(v);
        expect(Object.is(parse(text), v) || (v === 0 && parse(text) === 0)).toBe(true);
      }),
      { numRuns: 5000 },
    );
  });

  test.each(["", "  ", ".", "-", "e5", "1e", "1e+", "1e999", "0x1f", "1,5", "12a", "nan", "Infinity", '"1.5"', "1 2"])(
    "leaves %j to the general reader",
    (text) => {
      expect(Number.isNaN(parse(text))).toBe(true);
    },
  );
});

describe("readNumericLine", () => {
  test("reads the wanted cells and refuses a short or long row", () => {
    const out = new Float64Array(2);
    const line = bytesOf("1.5,skip,-2,4");
    expect(readNumericLine(line, 0, line.length, 0x2c, 4, Int32Array.of(0, 2), out)).toBe(true);
    expect(Array.from(out)).toEqual([1.5, -2]);
    expect(readNumericLine(line, 0, line.length, 0x2c, 5, Int32Array.of(0, 2), out)).toBe(false);
    expect(readNumericLine(line, 0, line.length, 0x2c, 3, Int32Array.of(0, 2), out)).toBe(false);
  });
});

describe("suitsFastLane", () => {
  test("quotes and lone carriage returns go to the CSV parser", () => {
    expect(suitsFastLane("a,b\r\n1,2\r\n")).toBe(true);
    expect(suitsFastLane('"a",b\n1,2\n')).toBe(false);
    expect(suitsFastLane("a,b\r1,2\r")).toBe(false);
  });
});

/** A file with everything a logger or a hand edit puts in: comments, blank lines, CRLF, exponents, signs, trailing delimiters. */
function messyCsv(rows: number): string {
  const lines = ["# logger 3, firmware 1.2", "", "time_ms,mag_x (uT),mag_y (uT),mag_z (uT),ax,ay,az,note"];
  for (let i = 0; i < rows; i++) {
    const y = i % 97 === 0 ? "-3.5e0" : i % 89 === 0 ? "+1.25" : (-3.5 + i / 1000).toFixed(4);
    const z = i % 53 === 0 ? "1234567890.123456" : (44.25 - i / 777).toFixed(6);
    const cells = [String(i * 10), (20 + i / 7).toFixed(3), y, z, "0.01", " -0.02 ", "-9.81", i % 5 === 0 ? "ok" : ""];
    lines.push(cells.join(",") + (i % 31 === 0 ? "," : ""));
    if (i % 400 === 0) lines.push("# hold changed");
    if (i % 250 === 0) lines.push("");
  }
  return lines.join(rows % 2 === 0 ? "\r\n" : "\n") + "\n";
}

async function ingestError(run: () => Promise<unknown> | unknown): Promise<IngestError> {
  try {
    await run();
  } catch (error) {
    if (error instanceof IngestError) return error;
    throw error;
  }
  throw new Error("expected an IngestError");
}

describe("the fast lane and the CSV parser give the same table", () => {
  test("full-precision doubles and exponents, as scripts print them, are read exactly", async () => {
    const lines = ["time,mag_x,mag_y,mag_z"];
    const values: number[][] = [];
    for (let i = 0; i < 200; i++) {
      const row = [i / 100, Math.sin(i) * 48.123456789, Math.cos(i) * 1e-5, -9.780940505564887 + i * 1e-13];
      values.push(row);
      lines.push(row.map(String).join(","));
    }
    const fast = await parseCsvStream(streamOf(lines.join("\n") + "\n", 777));
    const general = parseCsvTable(lines.join("\n") + "\n");
    for (const field of general.table.fields) expect(fast.table.columns[field]).toEqual(general.table.columns[field]);
    expect(Array.from(fast.table.columns["compass_a.x"])).toEqual(values.map((row) => row[1]));
    expect(Array.from(fast.table.columns["compass_a.z"])).toEqual(values.map((row) => row[3]));
  });

  test.each([2000, 2001])("messy file of %i rows, read in uneven chunks", async (rows) => {
    const text = messyCsv(rows);
    const general = parseCsvTable(text);
    for (const chunk of [1, 13, 4096, 1 << 20]) {
      if (chunk === 1 && rows > 2000) continue;
      const fast = await parseCsvStream(streamOf(text, chunk));
      expect(fast.table.fields).toEqual(general.table.fields);
      expect(fast.table.length).toBe(general.table.length);
      for (const field of general.table.fields) expect(fast.table.columns[field]).toEqual(general.table.columns[field]);
      expect(fast.ignoredColumns).toEqual(general.ignoredColumns);
    }
  });

  test.each([
    { label: "text in a number cell", edit: (l: string) => l.replace(",0.01,", ",abc,") },
    { label: "a short row", edit: (l: string) => l.split(",").slice(0, 5).join(",") },
    { label: "a decimal comma", edit: (l: string) => l.replace(",0.01,", ',"0,01",') },
    { label: "time going backwards", edit: () => "5,1,2,3,0,0,-9.8," },
    { label: "a number too large to hold", edit: (l: string) => l.replace(",0.01,", ",1e999,") },
    { label: "a long number with a stray letter", edit: (l: string) => l.replace(",0.01,", ",0.0100000000000000x,") },
  ])("the same message for $label", async ({ edit }) => {
    const lines = messyCsv(600).split("\r\n");
    lines[500] = edit(lines[500]);
    const text = lines.join("\r\n");
    const general = await ingestError(() => parseCsvTable(text));
    const fast = await ingestError(() => parseCsvStream(streamOf(text, 333)));
    expect(fast.message).toBe(general.message);
    expect(fast.row).toBe(501);
  });
});
