import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { connection } from "next/server";
import { devToolsEnabled } from "@/lib/env";
import { listCapturedMail } from "@/lib/mail-sink";

export const metadata: Metadata = { title: "Captured mail" };

/** Dev only: the messages the local SMTP sink caught, so a person can click their links. */
export default async function CapturedMailPage() {
  await connection();
  if (!devToolsEnabled) notFound();
  const messages = await listCapturedMail();
  return (
    <main className="mx-auto max-w-4xl space-y-6 px-6 py-10">
      <div>
        <p className="font-mono text-xs text-brass-600">development only</p>
        <h1 className="text-3xl font-semibold">Captured mail</h1>
        <p className="text-chart-muted">
          Everything the app sent through the local SMTP sink, newest first. Nothing here left this machine.
        </p>
      </div>
      {messages.length === 0 ? <p className="card p-6">No mail yet.</p> : null}
      <ul className="space-y-4">
        {messages.map((m) => (
          <li key={m.id} className="card p-5" data-testid="captured-mail">
            <p className="text-xs text-chart-muted">
              {m.receivedAt.replace("T", " ").slice(0, 19)} · to {m.to.join(", ")}
            </p>
            <h2 className="mt-1 text-lg font-semibold">{m.subject}</h2>
            <pre className="mt-3 whitespace-pre-wrap font-sans text-sm">{m.text}</pre>
            <ul className="mt-3 space-y-1">
              {(m.text.match(/https?:\/\/\S+/g) ?? []).map((href) => (
                <li key={href}>
                  <a href={href} className="link break-all text-sm">
                    {href}
                  </a>
                </li>
              ))}
            </ul>
          </li>
        ))}
      </ul>
    </main>
  );
}
