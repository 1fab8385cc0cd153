"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { workspaceAction } from "@/lib/action";
import { signOffRun } from "@/lib/data/run-sign-off";

const signOffSchema = z.object({
  runId: z.uuid({ error: "Unknown run." }),
  versionId: z.uuid({ error: "Unknown version." }),
  comment: z.string().trim().max(2000, "Keep the comment under 2000 characters.").default(""),
});

export const signOffRunAction = workspaceAction("run.sign-off", signOffSchema, async ({ viewer, access }, input) => {
  await signOffRun(access.workspace.id, viewer.id, input.runId, input.versionId, input.comment);
  revalidatePath(`/w/${access.workspace.slug}/runs/${input.runId}`);
  return { status: "ok", message: "Signed off. The sign-off is in the logbook." };
});
