"use server";

import { revalidatePath } from "next/cache";
import { workspaceAction, UserFacingError } from "@/lib/action";
import { InvitationError, revokeInvitation } from "@/lib/data/invitations";
import { revokeInvitationSchema } from "@/lib/validations/workspace";

export const revokeInvitationAction = workspaceAction("member.invite", revokeInvitationSchema, async ({ viewer, access }, input) => {
  try {
    await revokeInvitation(access.workspace.id, viewer.id, input.invitationId);
  } catch (error) {
    if (error instanceof InvitationError) throw new UserFacingError(error.message);
    throw error;
  }
  revalidatePath(`/w/${access.workspace.slug}/members`);
  return { status: "ok", message: "Invitation withdrawn." };
});
