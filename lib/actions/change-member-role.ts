"use server";

import { revalidatePath } from "next/cache";
import { workspaceAction, UserFacingError } from "@/lib/action";
import { changeMemberRole, MemberError } from "@/lib/data/members";
import { changeRoleSchema } from "@/lib/validations/workspace";

export const changeMemberRoleAction = workspaceAction("member.change-role", changeRoleSchema, async ({ viewer, access }, input) => {
  try {
    await changeMemberRole(access.workspace.id, viewer.id, input.membershipId, input.role);
  } catch (error) {
    if (error instanceof MemberError) throw new UserFacingError(error.message, "role");
    throw error;
  }
  revalidatePath(`/w/${access.workspace.slug}/members`);
  return { status: "ok", message: "Role changed." };
});
