"use server";

import { redirect } from "next/navigation";
import { z } from "zod";
import { userAction, UserFacingError } from "@/lib/action";
import { acceptInvitation, InvitationError } from "@/lib/data/invitations";

export const acceptInvitationAction = userAction(z.object({ token: z.string().min(10).max(100) }), async ({ viewer }, input) => {
  let slug: string;
  try {
    slug = (await acceptInvitation(input.token, viewer)).workspaceSlug;
  } catch (error) {
    if (error instanceof InvitationError) throw new UserFacingError(error.message);
    throw error;
  }
  redirect(`/w/${slug}`);
});
