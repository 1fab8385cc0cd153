import Link from "next/link";
import type { ReactNode } from "react";
import { Wordmark } from "@/components/brand/logo-mark";

/** Class sessions: guests have no workspace, so no workspace header — the mark, and the session. */
export default function LiveLayout({ children }: { children: ReactNode }) {
  return (
    <>
      <header className="border-b border-chart-rule bg-chart-sheet">
        <div className="mx-auto flex max-w-6xl items-center justify-between gap-4 px-4 py-3 sm:px-6">
          <Link href="/" className="text-lg">
            <Wordmark />
          </Link>
          <p className="text-xs font-semibold uppercase tracking-widest text-brass-600 dark:text-brass-300">Class session</p>
        </div>
      </header>
      <main className="mx-auto max-w-6xl px-4 py-8 sm:px-6">{children}</main>
    </>
  );
}
