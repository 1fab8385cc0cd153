import type { Metadata } from "next";
import Link from "next/link";
import { SignUpForm } from "@/components/auth/sign-up-form";
import { previewInvitation } from "@/lib/data/invitations";
import { ROLE_LABELS } from "@/lib/roles";

export const metadata: Metadata = { title: "Create an account" };

export default async function SignUpPage({ searchParams }: { searchParams: Promise<{ invitation?: string }> }) {
  const { invitation } = await searchParams;
  const preview = invitation ? await previewInvitation(invitation) : null;
  const open = preview?.status === "open";
  return (
    <>
      <div className="space-y-1">
        <h1 className="text-2xl font-semibold">Create your account</h1>
        {open ? (
          <p className="text-sm text-chart-muted">
            You will join <strong>{preview.workspaceName}</strong> as {ROLE_LABELS[preview.role]}.
          </p>
        ) : (
          <p className="text-sm text-chart-muted">
            Already have one?{" "}
            <Link href="/sign-in" className="link">
              Sign in
            </Link>
          </p>
        )}
      </div>
      <SignUpForm invitation={open ? invitation : undefined} email={open ? preview.email : undefined} />
    </>
  );
}
