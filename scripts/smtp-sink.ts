/**
 * A local SMTP server that accepts every message and stores it as JSON in the mail sink
 * folder (MAIL_SINK_DIR, default .data/mail), where the dev mail page and tests read it.
 * Started by the start, dev and test commands; never used in production.
 */
import fs from "node:fs/promises";
import path from "node:path";
import crypto from "node:crypto";
import { SMTPServer } from "smtp-server";
import { simpleParser, type AddressObject } from "mailparser";
import { mailSinkDir } from "@/lib/env";

function addresses(value: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(value) ? value : value ? [value] : [];
  return list.flatMap((a) => a.value.map((v) => v.address ?? "")).filter(Boolean);
}

export async function startSmtpSink(options: { port: number; dir?: string; host?: string }): Promise<SMTPServer> {
  const dir = options.dir ?? mailSinkDir;
  await fs.mkdir(dir, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          const receivedAt = new Date().toISOString();
          const id = `${receivedAt.replace(/[:.]/g, "-")}-${crypto.randomBytes(4).toString("hex")}`;
          const message = {
            id,
            receivedAt,
            from: addresses(parsed.from)[0] ?? "",
            to: addresses(parsed.to),
            subject: parsed.subject ?? "",
            text: parsed.text ?? "",
            html: typeof parsed.html === "string" ? parsed.html : null,
          };
          const file = path.join(dir, `${id}.json`);
          await fs.writeFile(`${file}.tmp`, JSON.stringify(message, null, 2));
          await fs.rename(`${file}.tmp`, file);
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(options.port, options.host ?? "127.0.0.1", () => resolve());
  });
  return server;
}

if (process.argv[1] && path.resolve(process.argv[1]) === path.resolve(__filename)) {
  const port = Number(process.env.SMTP_PORT ?? 2525);
  startSmtpSink({ port }).then(
    () => console.log(`[smtp-sink] listening on 127.0.0.1:${port}, storing mail in ${mailSinkDir}`),
    (error) => {
      console.error("[smtp-sink] failed to start:", error);
      process.exit(1);
    },
  );
}
