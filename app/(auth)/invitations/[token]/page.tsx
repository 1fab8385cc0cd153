import type { Metadata } from "next";
import Link from "next/link";
import { AcceptInvitationForm } from "@/components/auth/accept-invitation-form";
import { SignUpForm } from "@/components/auth/sign-up-form";
import { signOutAction } from "@/lib/actions/sign-out";
import { previewInvitation } from "@/lib/data/invitations";
import { getUserByEmail } from "@/lib/data/users";
import { getViewer } from "@/lib/guard";
import { ROLE_LABELS } from "@/lib/roles";

export const metadata: Metadata = { title: "Invitation" };

const STATUS_TEXT = {
  expired: "This invitation has expired.",
  accepted: "This invitation was already accepted.",
  revoked: "This invitation was withdrawn.",
} as const;

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const preview = await previewInvitation(token);
  if (!preview) {
    return (
      <>
        <h1 className="text-2xl font-semibold">Invitation not found</h1>
        <p className="text-chart-muted">The link is incomplete or not valid. Ask the workspace owner to send a new one.</p>
      </>
    );
  }
  const heading = (
    <div className="space-y-1">
      <p className="text-xs font-semibold uppercase tracking-widest text-brass-600">Invitation</p>
      <h1 className="text-2xl font-semibold">Join {preview.workspaceName}</h1>
      <p className="text-sm text-chart-muted">
        As <strong>{ROLE_LABELS[preview.role]}</strong>, for {preview.email}.
      </p>
    </div>
  );
  if (preview.status !== "open") {
    return (
      <>
        {heading}
        <p role="alert" className="rounded-lg bg-halt-soft px-3 py-2 text-sm">
          {STATUS_TEXT[preview.status]} Ask the workspace owner for a new one.
        </p>
      </>
    );
  }
  const viewer = await getViewer();
  if (viewer && viewer.email === preview.email) {
    return (
      <>
        {heading}
        <AcceptInvitationForm token={token} workspaceName={preview.workspaceName} />
      </>
    );
  }
  if (viewer) {
    return (
      <>
        {heading}
        <p role="alert" className="rounded-lg bg-heed-soft px-3 py-2 text-sm">
          You are signed in as {viewer.email}. Sign out, then open this link again to accept it as {preview.email}.
        </p>
        <form action={signOutAction}>
          <button type="submit" className="btn-quiet">
            Sign out
          </button>
        </form>
      </>
    );
  }
  const hasAccount = Boolean(await getUserByEmail(preview.email));
  return (
    <>
      {heading}
      {hasAccount ? (
        <Link href={`/sign-in?next=${encodeURIComponent(`/invitations/${token}`)}`} className="btn-primary">
          Sign in to accept
        </Link>
      ) : (
        <>
          <p className="text-sm text-chart-muted">Create your account to accept.</p>
          <SignUpForm invitation={token} email={preview.email} />
        </>
      )}
    </>
  );
}
