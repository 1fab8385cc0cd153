/**
 * Web Worker: reads the first rows of a picked capture file with papaparse, off the main
 * thread, so a 200 MB file never blocks the page. Only the head of the file is read.
 */
import Papa from "papaparse";
import { PREVIEW_BYTES, type FilePreview, type PreviewReply, type PreviewRequest } from "./preview-types";

const scope = self as unknown as {
  onmessage: ((event: MessageEvent<PreviewRequest>) => void) | null;
  postMessage(reply: PreviewReply): void;
};

/** Lines in a text, counting a last line without its newline; comment and blank lines are left out. */
function countDataLines(text: string): number {
  let lines = 0;
  let start = 0;
  for (let i = 0; i <= text.length; i++) {
    const code = i < text.length ? text.charCodeAt(i) : 10;
    if (code !== 10) continue;
    const line = text.slice(start, i).trim();
    if (line !== "" && !line.startsWith("#")) lines += 1;
    start = i + 1;
  }
  return lines;
}

async function readPreview({ id, file, rows }: PreviewRequest): Promise<PreviewReply> {
  const whole = file.size <= PREVIEW_BYTES;
  let text = await file.slice(0, PREVIEW_BYTES).text();
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  // The head of a large file ends mid-line; drop that piece.
  if (!whole) text = text.slice(0, Math.max(text.lastIndexOf("\n"), 0));

  const parsed = Papa.parse<string[]>(text, {
    preview: rows + 1,
    skipEmptyLines: "greedy",
    comments: "#",
    delimitersToGuess: [",", "\t", ";", "|"],
  });
  const [header, ...data] = parsed.data;
  if (!header || header.every((cell) => cell.trim() === "")) return { id, ok: false, message: "The file has no header row." };
  if (header.length < 2) {
    return {
      id,
      ok: false,
      message: `The first row, “${header[0].slice(0, 80)}”, is a single column: the delimiter was not recognised. Separate columns with commas, tabs, semicolons or vertical bars.`,
    };
  }

  const linesRead = countDataLines(text);
  const rowCount = whole ? Math.max(linesRead - 1, 0) : Math.max(Math.round((file.size / Math.max(text.length, 1)) * linesRead) - 1, 0);
  const ragged: FilePreview["ragged"] = [];
  data.forEach((cells, i) => {
    if (cells.length !== header.length) ragged.push({ row: i + 1, values: cells.length });
  });
  return {
    id,
    ok: true,
    preview: {
      headers: header.map((cell) => cell.trim()),
      rows: data,
      delimiter: parsed.meta.delimiter,
      rowCount,
      rowCountExact: whole,
      ragged,
    },
  };
}

scope.onmessage = (event) => {
  readPreview(event.data).then(
    (reply) => scope.postMessage(reply),
    (error: unknown) =>
      scope.postMessage({
        id: event.data.id,
        ok: false,
        message: `The file could not be read: ${error instanceof Error ? error.message : String(error)}`,
      }),
  );
};
