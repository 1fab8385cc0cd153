import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { SessionConsole } from "@/components/classroom/session-console";
import { requireWorkspacePage } from "@/lib/guard";

export const metadata: Metadata = { title: "Class session" };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export default async function SessionConsolePage({ params }: { params: Promise<{ slug: string; sessionId: string }> }) {
  const { slug, sessionId } = await params;
  await requireWorkspacePage(slug, "class.host");
  if (!UUID.test(sessionId)) notFound();
  return <SessionConsole slug={slug} sessionId={sessionId} />;
}
