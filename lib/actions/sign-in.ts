"use server";

import { redirect } from "next/navigation";
import { publicAction } from "@/lib/action";
import { authenticate } from "@/lib/data/users";
import { clientAddress } from "@/lib/guard";
import { getSession } from "@/lib/session";
import { signInSchema } from "@/lib/validations/auth";

/** Only same-site paths are followed after sign-in. */
function safeNext(next: string | undefined): string {
  return next && next.startsWith("/") && !next.startsWith("//") && !next.startsWith("/\\") ? next : "/workspaces";
}

export const signInAction = publicAction(signInSchema, async (_context, input, formData) => {
  const result = await authenticate(input.email, input.password, await clientAddress());
  if (!result.ok) {
    const message =
      result.reason === "rate-limited"
        ? `Too many sign-in attempts. Wait ${result.retryAfterMinutes} minutes, or reset your password.`
        : "That e-mail and password do not match an account.";
    return { status: "error", code: "failed", message, values: { email: String(formData.get("email") ?? "") } };
  }
  const session = await getSession();
  session.userId = result.user.id;
  session.signedInAt = Date.now();
  await session.save();
  redirect(safeNext(input.next));
});
