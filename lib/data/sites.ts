import "server-only";
import { UniqueConstraintError } from "sequelize";
import { UserFacingError } from "@/lib/errors";
import { recordAudit } from "@/lib/audit";
import { db } from "@/lib/db";
import type { Site } from "@/models";
import type { SiteSnapshot } from "@/models/run";

export interface SiteSummary {
  id: string;
  name: string;
  latitudeDeg: number;
  longitudeDeg: number;
  altitudeM: number;
  notes: string;
}

export interface SiteInput {
  name: string;
  latitudeDeg: number;
  longitudeDeg: number;
  altitudeM: number;
  notes: string;
}

function toSummary(s: Site): SiteSummary {
  return { id: s.id, name: s.name, latitudeDeg: s.latitudeDeg, longitudeDeg: s.longitudeDeg, altitudeM: s.altitudeM, notes: s.notes };
}

export function snapshotOf(site: SiteSummary): SiteSnapshot {
  return { siteId: site.id, name: site.name, latitudeDeg: site.latitudeDeg, longitudeDeg: site.longitudeDeg, altitudeM: site.altitudeM };
}

export async function listSites(workspaceId: string): Promise<SiteSummary[]> {
  return (await db().models.Site.findAll({ where: { workspaceId }, order: [["name", "ASC"]] })).map(toSummary);
}

export async function createSite(workspaceId: string, actorId: string, input: SiteInput): Promise<SiteSummary> {
  try {
    const site = await db().models.Site.create({ ...input, workspaceId, createdById: actorId });
    await recordAudit({ workspaceId, actorId, action: "site.created", targetType: "site", targetId: site.id, detail: { name: site.name } });
    return toSummary(site);
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw new UserFacingError("A site with this name already exists.", "name");
    throw error;
  }
}

export async function updateSite(workspaceId: string, actorId: string, id: string, input: SiteInput): Promise<SiteSummary | null> {
  const site = await db().models.Site.findOne({ where: { workspaceId, id } });
  if (!site) return null;
  try {
    await site.update(input);
  } catch (error) {
    if (error instanceof UniqueConstraintError) throw new UserFacingError("A site with this name already exists.", "name");
    throw error;
  }
  await recordAudit({ workspaceId, actorId, action: "site.updated", targetType: "site", targetId: id, detail: { name: site.name } });
  return toSummary(site);
}
