"use server";

import { publicAction } from "@/lib/action";
import { requestPasswordReset } from "@/lib/data/password-resets";
import { requestResetSchema } from "@/lib/validations/auth";

export const requestPasswordResetAction = publicAction(requestResetSchema, async (_context, input) => {
  await requestPasswordReset(input.email);
  return {
    status: "ok",
    message: "If an account uses that address, a link to choose a new password is on its way. It works for one hour.",
  };
});
