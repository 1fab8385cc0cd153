import type { Metadata } from "next";
import Link from "next/link";
import { ForgotPasswordForm } from "@/components/auth/forgot-password-form";

export const metadata: Metadata = { title: "Forgot password" };

export default function ForgotPasswordPage() {
  return (
    <>
      <div className="space-y-1">
        <h1 className="text-2xl font-semibold">Reset your password</h1>
        <p className="text-sm text-chart-muted">We will e-mail you a link to choose a new one.</p>
      </div>
      <ForgotPasswordForm />
      <Link href="/sign-in" className="link text-sm">
        Back to sign in
      </Link>
    </>
  );
}
