/**
 * A local S3-compatible object store (s3rver) for `npm start`, `npm run dev` and `npm test`,
 * with one bucket whose CORS rules let the browser PUT an upload straight to it by a
 * presigned URL. A real store is used instead when S3_ENDPOINT is set.
 */
import fs from "node:fs";
import S3rver from "s3rver";

const CORS = `<CORSConfiguration>
  <CORSRule>
    <AllowedOrigin>*</AllowedOrigin>
    <AllowedMethod>GET</AllowedMethod>
    <AllowedMethod>PUT</AllowedMethod>
    <AllowedMethod>HEAD</AllowedMethod>
    <AllowedHeader>*</AllowedHeader>
    <ExposeHeader>ETag</ExposeHeader>
    <MaxAgeSeconds>3000</MaxAgeSeconds>
  </CORSRule>
</CORSConfiguration>`;

export const FAKE_S3_CREDENTIALS = { accessKeyId: "S3RVER", secretAccessKey: "S3RVER" };

export async function startS3Fake(options: { port: number; directory: string; bucket: string }): Promise<{ close: () => Promise<void> }> {
  fs.mkdirSync(options.directory, { recursive: true });
  const server = new S3rver({
    address: "127.0.0.1",
    port: options.port,
    silent: true,
    directory: options.directory,
    configureBuckets: [{ name: options.bucket, configs: [CORS] }],
  });
  await server.run();
  return { close: () => server.close() };
}
