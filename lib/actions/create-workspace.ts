"use server";

import { redirect } from "next/navigation";
import { userAction, UserFacingError } from "@/lib/action";
import { createWorkspace, SlugTakenError } from "@/lib/data/workspaces";
import { createWorkspaceSchema } from "@/lib/validations/workspace";

export const createWorkspaceAction = userAction(createWorkspaceSchema, async ({ viewer }, input) => {
  let slug: string;
  try {
    slug = (await createWorkspace(viewer.id, input)).slug;
  } catch (error) {
    if (error instanceof SlugTakenError) throw new UserFacingError(error.message, "slug");
    throw error;
  }
  redirect(`/w/${slug}`);
});
