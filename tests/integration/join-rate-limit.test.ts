import { expect, test } from "vitest";
import { actAs } from "../support/request-context";
import { callRoute } from "../support/runs";

test("thirty wrong join codes from one address, then a pause with 429", async () => {
  actAs(null, "198.18.0.77");
  const join = (code: string) => callRoute("app/api/join/route.ts", "POST", {}, { code }).then((r) => r.status);
  // callRoute sends no forwarded address, so every call here counts against the same "local" key.
  const statuses: number[] = [];
  for (let i = 0; i < 31; i++) statuses.push(await join("ZZZZZZ"));
  expect(statuses.slice(0, 30).every((s) => s === 404)).toBe(true);
  expect(statuses[30]).toBe(429);
});
