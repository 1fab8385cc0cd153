import type { Metadata } from "next";
import { SiteList } from "@/components/sites/site-list";
import { listSites } from "@/lib/data/sites";
import { requireWorkspacePage } from "@/lib/guard";

export const metadata: Metadata = { title: "Sites" };

export default async function SitesPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { access, can } = await requireWorkspacePage(slug, "vehicle.view");
  const sites = await listSites(access.workspace.id);
  return (
    <div className="space-y-6">
      <div>
        <h2 className="text-2xl font-semibold">Sites</h2>
        <p className="max-w-prose text-chart-muted">
          A site sets the reference each run is checked against: the World Magnetic Model&apos;s field strength, inclination and declination
          there on the capture date, and the normal gravity at its latitude and altitude. Choose open ground away from steel, cars and
          reinforced concrete.
        </p>
      </div>
      <SiteList slug={slug} sites={sites} canEdit={can("site.edit")} />
    </div>
  );
}
