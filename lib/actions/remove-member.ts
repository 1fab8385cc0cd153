"use server";

import { revalidatePath } from "next/cache";
import { workspaceAction, UserFacingError } from "@/lib/action";
import { MemberError, removeMember } from "@/lib/data/members";
import { removeMemberSchema } from "@/lib/validations/workspace";

export const removeMemberAction = workspaceAction("member.remove", removeMemberSchema, async ({ viewer, access }, input) => {
  try {
    await removeMember(access.workspace.id, viewer.id, input.membershipId);
  } catch (error) {
    if (error instanceof MemberError) throw new UserFacingError(error.message);
    throw error;
  }
  revalidatePath(`/w/${access.workspace.slug}/members`);
  return { status: "ok", message: "Member removed." };
});
