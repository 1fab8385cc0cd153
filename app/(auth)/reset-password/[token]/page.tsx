import type { Metadata } from "next";
import Link from "next/link";
import { ResetPasswordForm } from "@/components/auth/reset-password-form";
import { isResetTokenUsable } from "@/lib/data/password-resets";

export const metadata: Metadata = { title: "Choose a new password" };

export default async function ResetPasswordPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const usable = await isResetTokenUsable(token);
  return (
    <>
      <h1 className="text-2xl font-semibold">Choose a new password</h1>
      {usable ? (
        <ResetPasswordForm token={token} />
      ) : (
        <div className="space-y-3">
          <p role="alert" className="rounded-lg bg-halt-soft px-3 py-2 text-sm">
            This reset link has expired or was already used.
          </p>
          <Link href="/forgot-password" className="link text-sm">
            Ask for a new link
          </Link>
        </div>
      )}
    </>
  );
}
