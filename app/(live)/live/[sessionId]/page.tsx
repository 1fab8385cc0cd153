import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { LiveViewer } from "@/components/classroom/live-viewer";
import { getViewer } from "@/lib/guard";

export const metadata: Metadata = { title: "Class session" };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Participants, hosts and guests alike: who may follow the session is decided by the session's own API. */
export default async function LivePage({ params }: { params: Promise<{ sessionId: string }> }) {
  const { sessionId } = await params;
  if (!UUID.test(sessionId)) notFound();
  const viewer = await getViewer();
  return <LiveViewer sessionId={sessionId} signedIn={viewer !== null} />;
}
