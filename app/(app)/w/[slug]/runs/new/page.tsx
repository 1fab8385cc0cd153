import type { Metadata } from "next";
import { RunUploader } from "@/components/upload/run-uploader";
import { listSites } from "@/lib/data/sites";
import { getVehicle, listVehicles } from "@/lib/data/vehicles";
import { requireWorkspacePage } from "@/lib/guard";
import { isRecordId } from "@/lib/ids";

export const metadata: Metadata = { title: "Upload a capture" };

export default async function NewRunPage({
  params,
  searchParams,
}: {
  params: Promise<{ slug: string }>;
  searchParams: Promise<{ run?: string | string[]; vehicle?: string | string[] }>;
}) {
  const { slug } = await params;
  const { run, vehicle } = await searchParams;
  const { access } = await requireWorkspacePage(slug, "run.create");
  const [vehicles, sites] = await Promise.all([
    listVehicles(access.workspace.id, { sort: "name", order: "asc", pageSize: 100 }),
    listSites(access.workspace.id),
  ]);
  const resumeRunId = typeof run === "string" && isRecordId(run) ? run : null;
  // Coming from a vehicle's page (?vehicle=): that vehicle is chosen, even beyond the first hundred.
  const chosen = typeof vehicle === "string" && isRecordId(vehicle) ? vehicle : null;
  const choices = vehicles.items.map((v) => ({ id: v.id, name: v.name, kind: v.kind }));
  if (chosen && !choices.some((v) => v.id === chosen)) {
    const extra = await getVehicle(access.workspace.id, chosen);
    if (extra && !extra.archived) choices.push({ id: extra.id, name: extra.name, kind: extra.kind });
  }
  return (
    <div className="space-y-6">
      <header>
        <h2 className="text-xl font-semibold">Upload a capture</h2>
        <p className="mt-1 max-w-prose text-sm text-chart-muted">
          The samples logged while the vehicle was turned through every orientation (and, for the accelerometer, held still on each face).
          They are fitted and checked on the server; this page follows the work to its verdict.
        </p>
      </header>
      <RunUploader
        slug={slug}
        vehicles={choices}
        vehiclesTotal={vehicles.total}
        initialVehicleId={chosen && choices.some((v) => v.id === chosen) ? chosen : null}
        sites={sites}
        resumeRunId={resumeRunId}
      />
    </div>
  );
}
