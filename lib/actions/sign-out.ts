"use server";

import { redirect } from "next/navigation";
import { getSession } from "@/lib/session";

export async function signOutAction(): Promise<void> {
  const session = await getSession();
  session.destroy();
  redirect("/sign-in?signed-out=1");
}
