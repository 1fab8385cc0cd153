"use server";

import { revalidatePath } from "next/cache";
import { workspaceAction } from "@/lib/action";
import { updateWorkspace } from "@/lib/data/workspaces";
import { updateWorkspaceSchema } from "@/lib/validations/workspace";

export const updateWorkspaceAction = workspaceAction("workspace.update", updateWorkspaceSchema, async ({ viewer, access }, input) => {
  await updateWorkspace(access.workspace.id, viewer.id, input);
  revalidatePath(`/w/${access.workspace.slug}`, "layout");
  return { status: "ok", message: "Workspace saved." };
});
