"use server";

import { redirect } from "next/navigation";
import { publicAction, UserFacingError } from "@/lib/action";
import { ResetError, resetPassword } from "@/lib/data/password-resets";
import { resetPasswordSchema } from "@/lib/validations/auth";

export const resetPasswordAction = publicAction(resetPasswordSchema, async (_context, input) => {
  try {
    await resetPassword(input.token, input.password);
  } catch (error) {
    if (error instanceof ResetError) throw new UserFacingError(error.message);
    throw error;
  }
  redirect("/sign-in?reset=1");
});
