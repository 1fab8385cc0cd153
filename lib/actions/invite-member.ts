"use server";

import { revalidatePath } from "next/cache";
import { workspaceAction, UserFacingError } from "@/lib/action";
import { InvitationError, inviteMember } from "@/lib/data/invitations";
import { inviteMemberSchema } from "@/lib/validations/workspace";

export const inviteMemberAction = workspaceAction("member.invite", inviteMemberSchema, async ({ viewer, access }, input) => {
  try {
    await inviteMember({ workspaceId: access.workspace.id, inviterId: viewer.id, email: input.email, role: input.role });
  } catch (error) {
    if (error instanceof InvitationError) throw new UserFacingError(error.message, "email");
    throw error;
  }
  revalidatePath(`/w/${access.workspace.slug}/members`);
  return { status: "ok", message: `Invitation sent to ${input.email}.` };
});
