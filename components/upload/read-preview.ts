import { PREVIEW_ROWS, type FilePreview, type PreviewReply } from "./preview-types";

let nextRequest = 1;

/**
 * Parses the head of `file` in a Web Worker (papaparse) and resolves with the preview, or
 * rejects with a message a person can act on. One short-lived worker per file.
 */
export function readPreview(file: File): Promise<FilePreview> {
  return new Promise((resolve, reject) => {
    const worker = new Worker(new URL("./preview.worker.ts", import.meta.url));
    const id = nextRequest++;
    worker.onmessage = (event: MessageEvent<PreviewReply>) => {
      if (event.data.id !== id) return;
      worker.terminate();
      if (event.data.ok) resolve(event.data.preview);
      else reject(new Error(event.data.message));
    };
    worker.onerror = (event) => {
      worker.terminate();
      reject(new Error(`The preview could not be made: ${event.message || "the browser stopped the reader"}.`));
    };
    worker.postMessage({ id, file, rows: PREVIEW_ROWS });
  });
}
