import type { Metadata } from "next";
import { JoinForm } from "@/components/classroom/join-form";
import { getViewer } from "@/lib/guard";

export const metadata: Metadata = { title: "Join a class session" };

export default async function JoinPage({ searchParams }: { searchParams: Promise<{ code?: string }> }) {
  const [{ code }, viewer] = await Promise.all([searchParams, getViewer()]);
  return (
    <div className="mx-auto max-w-md space-y-6">
      <div>
        <h1 className="text-2xl font-semibold">Join a class session</h1>
        <p className="text-chart-muted">Type the code your instructor shows, and the session opens on this screen.</p>
      </div>
      <JoinForm initialCode={typeof code === "string" ? code : ""} viewerName={viewer?.name ?? null} />
    </div>
  );
}
