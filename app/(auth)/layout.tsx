import Link from "next/link";
import type { ReactNode } from "react";
import { Wordmark } from "@/components/brand/logo-mark";

export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="grid min-h-screen lg:grid-cols-[1fr_minmax(28rem,34rem)]">
      <aside className="relative hidden overflow-hidden bg-lox-900 p-12 text-lox-50 lg:flex lg:flex-col lg:justify-between">
        <Link href="/" className="text-xl">
          <Wordmark />
        </Link>
        <div className="max-w-md space-y-4">
          <p className="font-display text-3xl leading-tight">A compass the flight controller accepted can still be wrong.</p>
          <p className="text-lox-200">
            Loxodrome fits, checks and keeps every calibration — coverage, residual, field strength against the World Magnetic Model,
            mounting rotation — and says what to do when one is off.
          </p>
        </div>
        <p className="font-mono text-xs text-lox-300">hard iron · soft iron · inclination · coverage</p>
      </aside>
      <main className="flex items-center justify-center px-6 py-12">
        <div className="w-full max-w-sm space-y-6">
          <Link href="/" className="text-lg lg:hidden">
            <Wordmark />
          </Link>
          {children}
        </div>
      </main>
    </div>
  );
}
