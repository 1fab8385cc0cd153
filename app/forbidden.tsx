import Link from "next/link";

export default function Forbidden() {
  return (
    <main className="mx-auto flex min-h-[60vh] max-w-lg flex-col items-center justify-center gap-4 px-6 text-center">
      <p className="font-mono text-sm text-chart-muted">403 · not for this role</p>
      <h1 className="text-3xl font-semibold">Your role does not open this page</h1>
      <p className="text-chart-muted">Ask an owner of the workspace if you need it.</p>
      <Link href="/workspaces" className="btn-quiet">
        Your workspaces
      </Link>
    </main>
  );
}
