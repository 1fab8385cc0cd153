/** Where and how the API says to send the file (a presigned URL straight to object storage). */
export interface UploadTicket {
  url: string;
  method: "PUT";
  headers: Record<string, string>;
  maxBytes: number;
}

export interface FileTransfer {
  done: Promise<void>;
  abort: () => void;
}

/**
 * PUTs the file to object storage with XMLHttpRequest, because fetch cannot report upload
 * progress. `onProgress` receives bytes sent and the total as they go.
 */
export function putFile(ticket: UploadTicket, file: File, onProgress: (sentBytes: number, totalBytes: number) => void): FileTransfer {
  const request = new XMLHttpRequest();
  const done = new Promise<void>((resolve, reject) => {
    request.open(ticket.method, ticket.url);
    for (const [name, value] of Object.entries(ticket.headers)) request.setRequestHeader(name, value);
    request.upload.onprogress = (event) => onProgress(event.loaded, event.lengthComputable ? event.total : file.size);
    request.onload = () => {
      if (request.status >= 200 && request.status < 300) {
        onProgress(file.size, file.size);
        resolve();
      } else reject(new Error(`Storage refused the file (HTTP ${request.status}).`));
    };
    request.onerror = () => reject(new Error("The connection to storage dropped during the upload."));
    request.onabort = () => reject(new DOMException("The upload was cancelled.", "AbortError"));
    request.send(file);
  });
  return { done, abort: () => request.abort() };
}
