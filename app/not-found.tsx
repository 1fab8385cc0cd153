import Link from "next/link";
import { LogoMark } from "@/components/brand/logo-mark";

export default function NotFound() {
  return (
    <main className="mx-auto flex min-h-screen max-w-lg flex-col items-center justify-center gap-4 px-6 text-center">
      <LogoMark className="h-14 w-14" title="" />
      <p className="font-mono text-sm text-chart-muted">404 · off the chart</p>
      <h1 className="text-3xl font-semibold">Nothing is charted here</h1>
      <p className="text-chart-muted">The page you asked for does not exist, or it is not yours to see.</p>
      <Link href="/" className="btn-primary">
        Back to the start
      </Link>
    </main>
  );
}
