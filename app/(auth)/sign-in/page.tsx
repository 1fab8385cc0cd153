import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { SignInForm } from "@/components/auth/sign-in-form";
import { getViewer } from "@/lib/guard";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const params = await searchParams;
  if (await getViewer()) redirect(params.next?.startsWith("/") ? params.next : "/workspaces");
  return (
    <>
      <div className="space-y-1">
        <h1 className="text-2xl font-semibold">Sign in</h1>
        <p className="text-sm text-chart-muted">
          New here?{" "}
          <Link href="/sign-up" className="link">
            Create an account
          </Link>
        </p>
      </div>
      {params.reset ? (
        <p role="status" className="rounded-lg bg-steady-soft px-3 py-2 text-sm">
          Your new password is set. Sign in with it.
        </p>
      ) : null}
      {params["signed-out"] ? (
        <p role="status" className="rounded-lg bg-chart-sheet px-3 py-2 text-sm">
          You are signed out.
        </p>
      ) : null}
      <SignInForm next={params.next} />
    </>
  );
}
