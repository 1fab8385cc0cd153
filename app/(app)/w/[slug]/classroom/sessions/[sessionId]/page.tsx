import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { SessionConsole } from "@/components/classroom/session-console";
import { requireWorkspacePage } from "@/lib/guard";
import { isRecordId } from "@/lib/ids";

export const metadata: Metadata = { title: "Class session" };

export default async function SessionConsolePage({ params }: { params: Promise<{ slug: string; sessionId: string }> }) {
  const { slug, sessionId } = await params;
  await requireWorkspacePage(slug, "class.host");
  if (!isRecordId(sessionId)) notFound();
  return <SessionConsole slug={slug} sessionId={sessionId} />;
}
