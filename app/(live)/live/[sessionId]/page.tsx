import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { LiveViewer } from "@/components/classroom/live-viewer";
import { getViewer } from "@/lib/guard";
import { isRecordId } from "@/lib/ids";

export const metadata: Metadata = { title: "Class session" };

/** Participants, hosts and guests alike: who may follow the session is decided by the session's own API. */
export default async function LivePage({ params }: { params: Promise<{ sessionId: string }> }) {
  const { sessionId } = await params;
  if (!isRecordId(sessionId)) notFound();
  const viewer = await getViewer();
  return <LiveViewer sessionId={sessionId} signedIn={viewer !== null} />;
}
