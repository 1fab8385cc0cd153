import { db } from "@/lib/db";
import { hashPassword } from "@/lib/password";
import { DEMO_PEOPLE, DEMO_WORKSPACES } from "@/lib/seed/demo-people";

/**
 * Create the demo workspaces and people when they are missing. Idempotent: a second run
 * changes nothing, and nothing a user made in the demo workspaces is touched.
 */
export async function seedDemo(log: (line: string) => void = () => {}): Promise<{ created: boolean }> {
  const { sequelize, models } = db();
  const existing = await models.Workspace.findOne({ where: { slug: DEMO_WORKSPACES[0].slug } });
  if (existing) {
    log("demo workspaces already present");
    await seedFleetOf(existing.id, log);
    return { created: false };
  }
  await sequelize.transaction(async (transaction) => {
    const workspaces = new Map<string, string>();
    for (const w of DEMO_WORKSPACES) workspaces.set(w.slug, (await models.Workspace.create(w, { transaction })).id);
    for (const person of DEMO_PEOPLE) {
      const user =
        (await models.User.findOne({ where: { email: person.email }, transaction })) ??
        (await models.User.create(
          { name: person.name, email: person.email, passwordHash: await hashPassword(person.password) },
          { transaction },
        ));
      for (const m of person.memberships) {
        await models.Membership.create({ workspaceId: workspaces.get(m.workspace)!, userId: user.id, role: m.role }, { transaction });
      }
    }
    for (const [slug, id] of workspaces) {
      await models.AuditEvent.create(
        {
          workspaceId: id,
          actorId: null,
          action: "workspace.created",
          targetType: "workspace",
          targetId: id,
          detail: { seeded: true, slug },
          ipAddress: null,
        },
        { transaction },
      );
    }
  });
  log(`created ${DEMO_WORKSPACES.length} demo workspaces and ${DEMO_PEOPLE.length} people`);
  const operator = await models.Workspace.findOne({ where: { slug: DEMO_WORKSPACES[0].slug } });
  await seedFleetOf(operator!.id, log);
  return { created: true };
}

/** The operator's fleet and simulated runs, made by the demo technician; skipped once present. */
async function seedFleetOf(workspaceId: string, log: (line: string) => void): Promise<void> {
  const { models } = db();
  const technician = await models.User.findOne({
    where: { email: DEMO_PEOPLE.find((p) => p.memberships.some((m) => m.role === "technician"))!.email },
  });
  const { seedDemoFleet } = await import("@/lib/seed/demo-fleet");
  await seedDemoFleet(workspaceId, technician!.id, log);
  await (await import("@/lib/seed/demo-scenarios")).seedDemoScenarios(log);
}

export function demoCredentialsTable(): string {
  const rows = DEMO_PEOPLE.map(
    (p) => `  ${p.email.padEnd(28)} ${p.password.padEnd(20)} ${p.memberships.map((m) => `${m.role}@${m.workspace}`).join(", ")}`,
  );
  return ["  e-mail                       password             role@workspace", ...rows].join("\n");
}
