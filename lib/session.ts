import "server-only";
import { cookies } from "next/headers";
import { getIronSession, type SessionOptions } from "iron-session";
import { sessionSecret } from "@/lib/env";

export interface SessionData {
  userId?: string;
  signedInAt?: number;
}

export const SESSION_COOKIE = "loxodrome_session";
const MAX_AGE_S = 60 * 60 * 24 * 14;

function options(): SessionOptions {
  return {
    password: sessionSecret(),
    cookieName: SESSION_COOKIE,
    ttl: MAX_AGE_S,
    cookieOptions: {
      httpOnly: true,
      sameSite: "lax",
      // Plain-HTTP local runs and browser tests need a non-secure cookie; production is HTTPS.
      secure: process.env.NODE_ENV === "production" && process.env.LOXODROME_INSECURE_COOKIES !== "1",
      path: "/",
    },
  };
}

/** The signed, encrypted session cookie of the current request. */
export async function getSession() {
  // iron-session's cookie-store type predates Next's async cookies(); the shapes are compatible.
  return getIronSession<SessionData>(await cookies(), options());
}
