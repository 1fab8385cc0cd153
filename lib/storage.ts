import "server-only";
import { Readable } from "node:stream";
import { GetObjectCommand, HeadObjectCommand, PutObjectCommand, S3Client } from "@aws-sdk/client-s3";
import { getSignedUrl } from "@aws-sdk/s3-request-presigner";
import { storage as settings } from "@/lib/env";

/**
 * Object storage through the S3 SDK: uploads and the compact sample arrays of each run.
 * Locally this is the s3rver fake the start and test commands run; any S3-compatible store
 * is configured with the S3_* variables (README, "Configuration").
 */
// The SDK warns once per process that future releases will need Node 22; this project runs on
// Node 20 with the SDK version pinned in package-lock.json, so the warning only adds noise to logs.
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= "true";

let client: S3Client | undefined;
let publicClient: S3Client | undefined;

function makeClient(endpoint: string): S3Client {
  return new S3Client({
    endpoint,
    region: settings.region,
    forcePathStyle: settings.forcePathStyle,
    credentials: { accessKeyId: settings.accessKeyId, secretAccessKey: settings.secretAccessKey },
    // The fake (and some S3-compatible stores) predate the SDK's default request checksums.
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
}

function s3(): S3Client {
  client ??= makeClient(settings.endpoint);
  return client;
}

/** Presigned URLs are signed for the address a browser can reach, which may differ from the server's. */
function s3ForBrowsers(): S3Client {
  publicClient ??= makeClient(settings.publicEndpoint);
  return publicClient;
}

export async function presignUpload(key: string, contentType: string, expiresInS = 3600): Promise<string> {
  return getSignedUrl(s3ForBrowsers(), new PutObjectCommand({ Bucket: settings.bucket, Key: key, ContentType: contentType }), {
    expiresIn: expiresInS,
  });
}

export async function presignDownload(key: string, fileName: string, expiresInS = 900): Promise<string> {
  return getSignedUrl(
    s3ForBrowsers(),
    new GetObjectCommand({
      Bucket: settings.bucket,
      Key: key,
      ResponseContentDisposition: `attachment; filename="${fileName.replace(/"/g, "")}"`,
    }),
    { expiresIn: expiresInS },
  );
}

/** Size in bytes of a stored object, or null when it is not there. */
export async function objectSize(key: string): Promise<number | null> {
  try {
    const head = await s3().send(new HeadObjectCommand({ Bucket: settings.bucket, Key: key }));
    return head.ContentLength ?? 0;
  } catch (error) {
    const status = (error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;
    if (status === 404 || (error as Error).name === "NotFound" || (error as Error).name === "NoSuchKey") return null;
    throw error;
  }
}

export async function readObjectStream(key: string): Promise<Readable> {
  const response = await s3().send(new GetObjectCommand({ Bucket: settings.bucket, Key: key }));
  return response.Body as Readable;
}

/**
 * The first `bytes` of a stored object (a ranged GET), enough to read a capture's header
 * without fetching the whole file. Shorter when the object is.
 */
export async function readObjectHead(key: string, bytes = 64 * 1024): Promise<Buffer> {
  const response = await s3().send(new GetObjectCommand({ Bucket: settings.bucket, Key: key, Range: `bytes=0-${bytes - 1}` }));
  const chunks: Buffer[] = [];
  let length = 0;
  for await (const chunk of response.Body as Readable) {
    chunks.push(Buffer.from(chunk));
    length += chunk.length;
    // A store that ignores the range sends the whole object: stop (and close it) once the head is in.
    if (length >= bytes) break;
  }
  return Buffer.concat(chunks).subarray(0, bytes);
}

export async function readObject(key: string): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of await readObjectStream(key)) chunks.push(Buffer.from(chunk));
  return Buffer.concat(chunks);
}

export async function putObject(key: string, body: Buffer | Uint8Array | string, contentType = "application/octet-stream"): Promise<void> {
  await s3().send(new PutObjectCommand({ Bucket: settings.bucket, Key: key, Body: body, ContentType: contentType }));
}
