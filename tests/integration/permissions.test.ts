/**
 * Every route handler and every server action, called as each role of a workspace, as a
 * member of another workspace only, and anonymously. Permitted calls must work; the rest
 * must answer 401 / 403 / 404 (or the matching action error code) and reveal no data.
 * The expected matrix is written out here, independently of lib/permissions.ts, and it
 * matches the README's "Roles" table. A completeness check fails when a new route or action
 * is added without a row here.
 */
import fs from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { idle, type ActionState } from "@/lib/action-state";
import { closeDb, db } from "@/lib/db";
import { inviteMember } from "@/lib/data/invitations";
import type { UserSummary } from "@/lib/data/users";
import type { WorkspaceSummary } from "@/lib/data/workspaces";
import type { Role } from "@/lib/roles";
import { actAs } from "../support/request-context";
import { addMember, form, makeUser, makeWorkspace, uniqueTag } from "../support/factories";

type Actor = Role | "outsider" | "anonymous";
const ACTORS: Actor[] = ["owner", "technician", "builder", "instructor", "student", "outsider", "anonymous"];
const ALL_ROLES: Role[] = ["owner", "technician", "builder", "instructor", "student"];

let workspace: WorkspaceSummary;
const users = {} as Record<Exclude<Actor, "anonymous">, UserSummary>;

beforeAll(async () => {
  users.owner = await makeUser("owner");
  workspace = await makeWorkspace(users.owner, "perm");
  for (const role of ["technician", "builder", "instructor", "student"] as const) {
    users[role] = await makeUser(role);
    await addMember(workspace, users[role], role);
  }
  // The outsider owns a workspace of their own: being signed in and powerful elsewhere must not help.
  users.outsider = await makeUser("outsider");
  await makeWorkspace(users.outsider, "other");
});

afterAll(() => closeDb());

function actAsActor(actor: Actor) {
  actAs(actor === "anonymous" ? null : users[actor].id);
}

async function route(file: string, method: string) {
  const mod = (await import(/* @vite-ignore */ path.resolve(file))) as Record<string, (req: Request, ctx: unknown) => Promise<Response>>;
  return mod[method];
}

async function action(name: string) {
  const mod = (await import(/* @vite-ignore */ path.resolve(`lib/actions/${name}.ts`))) as Record<string, (s: ActionState, f: FormData) => Promise<ActionState>>;
  return Object.values(mod)[0];
}

interface WorkspaceRouteCase {
  file: string;
  method: "GET" | "POST";
  allowed: Role[];
  body?: () => Record<string, unknown>;
  okStatus: number;
  dataKey: string;
}

const WORKSPACE_ROUTES: WorkspaceRouteCase[] = [
  { file: "app/api/workspaces/[slug]/route.ts", method: "GET", allowed: ALL_ROLES, okStatus: 200, dataKey: "workspace" },
  { file: "app/api/workspaces/[slug]/members/route.ts", method: "GET", allowed: ["owner", "technician", "builder", "instructor"], okStatus: 200, dataKey: "members" },
  { file: "app/api/workspaces/[slug]/invitations/route.ts", method: "GET", allowed: ["owner"], okStatus: 200, dataKey: "invitations" },
  {
    file: "app/api/workspaces/[slug]/invitations/route.ts",
    method: "POST",
    allowed: ["owner"],
    body: () => ({ email: `invitee-${uniqueTag()}@tests.example`, role: "builder" }),
    okStatus: 201,
    dataKey: "invitation",
  },
  { file: "app/api/workspaces/[slug]/audit/route.ts", method: "GET", allowed: ["owner", "technician"], okStatus: 200, dataKey: "events" },
];

describe.each(WORKSPACE_ROUTES)("$method $file", (c) => {
  test.each(ACTORS)("as %s", async (actor) => {
    actAsActor(actor);
    const handler = await route(c.file, c.method);
    const request = new Request(`http://test.local/api/workspaces/${workspace.slug}`, {
      method: c.method,
      headers: { "content-type": "application/json" },
      body: c.body ? JSON.stringify(c.body()) : undefined,
    });
    const response = await handler(request, { params: Promise.resolve({ slug: workspace.slug }) });
    const json = await response.json();
    const expected =
      actor === "anonymous" ? 401 : actor === "outsider" ? 404 : c.allowed.includes(actor) ? c.okStatus : 403;
    expect(response.status).toBe(expected);
    if (expected === c.okStatus) {
      expect(json[c.dataKey]).toBeDefined();
    } else {
      expect(Object.keys(json).sort()).toEqual(["error", "message"]);
      expect(JSON.stringify(json)).not.toContain(workspace.name);
    }
  });
});

describe("user routes", () => {
  test.each([
    ["app/api/me/route.ts", "GET"],
    ["app/api/workspaces/route.ts", "GET"],
    ["app/api/workspaces/route.ts", "POST"],
  ])("%s %s: 401 anonymous, only the caller's own workspaces otherwise", async (file, method) => {
    const handler = await route(file, method);
    const makeRequest = () =>
      new Request("http://test.local/api", {
        method,
        headers: { "content-type": "application/json" },
        body: method === "POST" ? JSON.stringify({ name: "Outsider's second", slug: `second-${uniqueTag()}`, kind: "school" }) : undefined,
      });
    actAs(null);
    expect((await handler(makeRequest(), { params: Promise.resolve({}) })).status).toBe(401);
    actAsActor("outsider");
    const response = await handler(makeRequest(), { params: Promise.resolve({}) });
    expect(response.status).toBe(method === "POST" ? 201 : 200);
    expect(JSON.stringify(await response.json())).not.toContain(workspace.slug);
  });

  test("health answers without a session and says nothing private", async () => {
    actAs(null);
    const response = await (await route("app/api/health/route.ts", "GET"))(new Request("http://test.local/api/health"), {});
    expect(response.status).toBe(200);
    expect(await response.json()).toEqual({ status: "ok" });
  });
});

interface WorkspaceActionCase {
  name: string;
  allowed: Role[];
  /** Valid input for one call, creating whatever the call acts on. */
  input: () => Promise<Record<string, string>>;
  /** Did the call change anything? Used to prove a denied call wrote nothing. */
  changed: (input: Record<string, string>) => Promise<boolean>;
}

async function freshMember(): Promise<Record<string, string>> {
  const user = await makeUser("victim");
  await addMember(workspace, user, "builder");
  const membership = await db().models.Membership.findOne({ where: { workspaceId: workspace.id, userId: user.id } });
  return { membershipId: membership!.id };
}

const WORKSPACE_ACTIONS: WorkspaceActionCase[] = [
  {
    name: "update-workspace",
    allowed: ["owner"],
    input: async () => ({ name: `Renamed ${uniqueTag()}`, kind: "operator" }),
    changed: async (input) => (await db().models.Workspace.findByPk(workspace.id))!.name === input.name,
  },
  {
    name: "invite-member",
    allowed: ["owner"],
    input: async () => ({ email: `inv-${uniqueTag()}@tests.example`, role: "technician" }),
    changed: async (input) => (await db().models.Invitation.count({ where: { email: input.email } })) > 0,
  },
  {
    name: "revoke-invitation",
    allowed: ["owner"],
    input: async () => {
      const invitation = await inviteMember({ workspaceId: workspace.id, inviterId: users.owner.id, email: `rev-${uniqueTag()}@tests.example`, role: "student" });
      return { invitationId: invitation.id };
    },
    changed: async (input) => Boolean((await db().models.Invitation.findByPk(input.invitationId))!.revokedAt),
  },
  {
    name: "change-member-role",
    allowed: ["owner"],
    input: async () => ({ ...(await freshMember()), role: "technician" }),
    changed: async (input) => (await db().models.Membership.findByPk(input.membershipId))!.role === "technician",
  },
  {
    name: "remove-member",
    allowed: ["owner"],
    input: freshMember,
    changed: async (input) => (await db().models.Membership.findByPk(input.membershipId)) === null,
  },
];

describe.each(WORKSPACE_ACTIONS)("action $name", (c) => {
  test.each(ACTORS)("as %s", async (actor) => {
    const input = await c.input();
    actAsActor(actor);
    const run = await action(c.name);
    const state = await run(idle, form({ workspace: workspace.slug, ...input }));
    if (actor !== "anonymous" && actor !== "outsider" && c.allowed.includes(actor)) {
      expect(state.status).toBe("ok");
      expect(await c.changed(input)).toBe(true);
    } else {
      const code = actor === "anonymous" ? "unauthenticated" : actor === "outsider" ? "not-found" : "forbidden";
      expect(state).toMatchObject({ status: "error", code });
      expect(JSON.stringify(state)).not.toContain(workspace.name);
      expect(await c.changed(input)).toBe(false);
    }
  });
});

describe("actions outside a workspace", () => {
  test.each(["create-workspace", "accept-invitation"])("%s needs a session", async (name) => {
    actAs(null);
    const state = await (await action(name))(idle, form({ name: "X workspace", slug: `x-${uniqueTag()}`, kind: "other", token: "x".repeat(20) }));
    expect(state).toMatchObject({ status: "error", code: "unauthenticated" });
  });

  test("accept-invitation works only for the invited address", async () => {
    const email = `only-${uniqueTag()}@tests.example`;
    const { newToken } = await import("@/lib/tokens");
    const { token, tokenHash } = newToken();
    await db().models.Invitation.create({ workspaceId: workspace.id, email, role: "student", tokenHash, invitedById: users.owner.id, expiresAt: new Date(Date.now() + 3600_000) });
    actAsActor("outsider");
    const state = await (await action("accept-invitation"))(idle, form({ token }));
    expect(state).toMatchObject({ status: "error", message: expect.stringContaining(email) });
    expect(await db().models.Membership.count({ where: { workspaceId: workspace.id, userId: users.outsider.id } })).toBe(0);
  });

  test("the last owner can neither leave the owner role nor be removed", async () => {
    const owner = await makeUser("solo");
    const solo = await makeWorkspace(owner, "solo");
    const membership = await db().models.Membership.findOne({ where: { workspaceId: solo.id, userId: owner.id } });
    actAs(owner.id);
    const demote = await (await action("change-member-role"))(idle, form({ workspace: solo.slug, membershipId: membership!.id, role: "builder" }));
    expect(demote).toMatchObject({ status: "error", message: expect.stringMatching(/at least one owner/) });
    const remove = await (await action("remove-member"))(idle, form({ workspace: solo.slug, membershipId: membership!.id }));
    expect(remove).toMatchObject({ status: "error", message: expect.stringMatching(/last owner/) });
  });

  test("a membership id from another workspace is not found, even for an owner", async () => {
    const other = await makeUser("foreign");
    const otherWs = await makeWorkspace(other, "foreign");
    const foreign = await db().models.Membership.findOne({ where: { workspaceId: otherWs.id } });
    actAsActor("owner");
    const state = await (await action("remove-member"))(idle, form({ workspace: workspace.slug, membershipId: foreign!.id }));
    expect(state.status).toBe("error");
    expect(await db().models.Membership.findByPk(foreign!.id)).not.toBeNull();
  });
});

describe("completeness", () => {
  function walk(dir: string): string[] {
    return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? walk(path.join(dir, e.name)) : [path.join(dir, e.name)]));
  }

  test("every route handler is walked above", async () => {
    const covered = new Set([
      ...WORKSPACE_ROUTES.map((c) => `${c.method} ${c.file}`),
      "GET app/api/me/route.ts",
      "GET app/api/workspaces/route.ts",
      "POST app/api/workspaces/route.ts",
      "GET app/api/health/route.ts",
    ]);
    const found: string[] = [];
    for (const file of walk("app").filter((f) => f.endsWith("route.ts"))) {
      const mod = await import(/* @vite-ignore */ path.resolve(file));
      for (const method of ["GET", "POST", "PUT", "PATCH", "DELETE"]) if (method in mod) found.push(`${method} ${file}`);
    }
    expect(found.filter((entry) => !covered.has(entry))).toEqual([]);
  });

  test("every server action is walked above", () => {
    const covered = new Set([
      ...WORKSPACE_ACTIONS.map((c) => c.name),
      "create-workspace",
      "accept-invitation",
      // Public by design; their behaviour is covered in accounts.test.ts.
      "sign-in",
      "sign-up",
      "sign-out",
      "request-password-reset",
      "reset-password",
    ]);
    const found = fs.readdirSync("lib/actions").map((f) => f.replace(/\.ts$/, ""));
    expect(found.filter((name) => !covered.has(name))).toEqual([]);
  });
});
