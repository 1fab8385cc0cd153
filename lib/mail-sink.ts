import fs from "node:fs/promises";
import path from "node:path";
import { mailSinkDir } from "@/lib/env";

/** A message as stored by the local SMTP sink (scripts/smtp-sink.ts), one JSON file each. */
export interface CapturedMail {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
}

/** Newest first. Reads the sink's folder; empty when nothing was captured yet. */
export async function listCapturedMail(dir = mailSinkDir): Promise<CapturedMail[]> {
  let names: string[];
  try {
    names = (await fs.readdir(dir)).filter((n) => n.endsWith(".json"));
  } catch {
    return [];
  }
  const messages = await Promise.all(
    names.map(async (name) => JSON.parse(await fs.readFile(path.join(dir, name), "utf8")) as CapturedMail),
  );
  return messages.sort((a, b) => b.receivedAt.localeCompare(a.receivedAt) || b.id.localeCompare(a.id));
}
