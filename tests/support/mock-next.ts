import { vi } from "vitest";
import { fakeRequest } from "./request-context";

vi.mock("@/lib/session", () => ({
  SESSION_COOKIE: "loxodrome_session",
  getSession: async () => {
    const request = fakeRequest();
    return {
      get userId() {
        return request.userId;
      },
      set userId(value: string | undefined) {
        request.userId = value;
      },
      signedInAt: undefined as number | undefined,
      save: async () => {
        request.saved += 1;
      },
      destroy: () => {
        request.destroyed += 1;
        request.userId = undefined;
      },
    };
  },
}));

vi.mock("next/headers", () => ({
  headers: async () => new Headers({ "x-forwarded-for": fakeRequest().ip }),
  cookies: async () => ({ get: () => undefined, set: () => undefined, delete: () => undefined }),
}));

vi.mock("next/cache", () => ({
  revalidatePath: () => undefined,
  revalidateTag: () => undefined,
  updateTag: () => undefined,
}));
