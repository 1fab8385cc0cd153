/** What the preview worker is asked and what it answers; shared by the worker and the page. */

/** Data rows parsed for the preview. */
export const PREVIEW_ROWS = 200;
/** Bytes read from the start of the file: enough for the preview and a fair estimate of the row count. */
export const PREVIEW_BYTES = 1024 * 1024;

export const DELIMITER_NAMES: Record<string, string> = { ",": "comma", "\t": "tab", ";": "semicolon", "|": "vertical bar" };

export interface PreviewRequest {
  id: number;
  file: File;
  rows: number;
}

export interface FilePreview {
  /** Column names as written, trimmed. */
  headers: string[];
  /** The first data rows, as text. */
  rows: string[][];
  delimiter: string;
  /** Data rows in the whole file: counted when the file was read whole, else estimated from the bytes per row. */
  rowCount: number;
  rowCountExact: boolean;
  /** Preview rows whose number of values differs from the header (1-based data row number). */
  ragged: { row: number; values: number }[];
}

export type PreviewReply = { id: number; ok: true; preview: FilePreview } | { id: number; ok: false; message: string };
