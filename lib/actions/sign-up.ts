"use server";

import { redirect } from "next/navigation";
import { publicAction, UserFacingError } from "@/lib/action";
import { acceptInvitation, InvitationError } from "@/lib/data/invitations";
import { createUser, EmailTakenError } from "@/lib/data/users";
import { getSession } from "@/lib/session";
import { signUpSchema } from "@/lib/validations/auth";

export const signUpAction = publicAction(signUpSchema, async (_context, input) => {
  let user;
  try {
    user = await createUser(input);
  } catch (error) {
    if (error instanceof EmailTakenError) throw new UserFacingError(error.message, "email");
    throw error;
  }
  const session = await getSession();
  session.userId = user.id;
  session.signedInAt = Date.now();
  await session.save();
  if (input.invitation) {
    try {
      const { workspaceSlug } = await acceptInvitation(input.invitation, user);
      redirect(`/w/${workspaceSlug}`);
    } catch (error) {
      if (!(error instanceof InvitationError)) throw error;
      // The account exists either way; show why the invitation did not apply.
      redirect(`/invitations/${encodeURIComponent(input.invitation)}`);
    }
  }
  redirect("/workspaces/new");
});
