import { NextResponse } from "next/server";
import { readJson, workspaceRoute } from "@/lib/api";
import { UserFacingError } from "@/lib/action";
import { InvitationError, inviteMember, listOpenInvitations } from "@/lib/data/invitations";
import { inviteMemberSchema } from "@/lib/validations/workspace";

export const GET = workspaceRoute("member.invite", async (_request, { access }) =>
  NextResponse.json({ invitations: await listOpenInvitations(access.workspace.id) }),
);

/** Invite someone by e-mail with a role; the message goes out through SMTP. */
export const POST = workspaceRoute("member.invite", async (request, { access, viewer }) => {
  const body = await readJson(request, inviteMemberSchema);
  if (!body.ok) return body.response;
  try {
    const invitation = await inviteMember({ workspaceId: access.workspace.id, inviterId: viewer.id, ...body.data });
    return NextResponse.json({ invitation }, { status: 201 });
  } catch (error) {
    if (error instanceof InvitationError) throw new UserFacingError(error.message);
    throw error;
  }
});
