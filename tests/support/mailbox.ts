import { listCapturedMail, type CapturedMail } from "@/lib/mail-sink";

/** Wait for the SMTP sink to store a message to `to` whose subject matches. */
export async function waitForMail(to: string, subject: RegExp, timeoutMs = 10_000): Promise<CapturedMail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const found = (await listCapturedMail()).find((m) => m.to.includes(to) && subject.test(m.subject));
    if (found) return found;
    if (Date.now() > deadline) throw new Error(`no mail to ${to} matching ${subject} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

export function linkIn(mail: CapturedMail, pathPrefix: string): string {
  const link = mail.text.match(/https?:\/\/\S+/g)?.find((href) => new URL(href).pathname.startsWith(pathPrefix));
  if (!link) throw new Error(`no ${pathPrefix} link in mail "${mail.subject}"`);
  return link;
}
