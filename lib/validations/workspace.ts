import { z } from "zod";
import { ROLES, WORKSPACE_KINDS } from "@/lib/roles";
import { emailSchema } from "@/lib/validations/auth";

export const slugSchema = z
  .string()
  .trim()
  .toLowerCase()
  .min(3, "Use at least 3 characters.")
  .max(48, "Use at most 48 characters.")
  .regex(/^[a-z0-9](?:[a-z0-9-]*[a-z0-9])?$/, "Use lower-case letters, digits and dashes.");

export const createWorkspaceSchema = z.object({
  name: z.string().trim().min(2, "Give the workspace a name of at least 2 characters.").max(120, "Use at most 120 characters."),
  slug: slugSchema,
  kind: z.enum(WORKSPACE_KINDS, { error: "Choose what kind of workspace this is." }),
});

export const updateWorkspaceSchema = createWorkspaceSchema.pick({ name: true, kind: true });

export const roleSchema = z.enum(ROLES, { error: "Choose a role." });

export const inviteMemberSchema = z.object({
  email: emailSchema,
  role: roleSchema,
});

export const changeRoleSchema = z.object({
  membershipId: z.uuid({ error: "Unknown member." }),
  role: roleSchema,
});

export const removeMemberSchema = z.object({
  membershipId: z.uuid({ error: "Unknown member." }),
});

export const revokeInvitationSchema = z.object({
  invitationId: z.uuid({ error: "Unknown invitation." }),
});
