import type { ReactNode } from "react";
import { requireViewer } from "@/lib/guard";

/** Everything in this group needs a signed-in user; pages add their own workspace checks. */
export default async function SignedInLayout({ children }: { children: ReactNode }) {
  await requireViewer();
  return <>{children}</>;
}
