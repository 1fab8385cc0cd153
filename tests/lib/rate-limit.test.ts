import { describe, expect, test } from "vitest";
import { FailureLimiter } from "@/lib/rate-limit";

describe("FailureLimiter", () => {
  test("blocks a key at the limit and forgets failures older than the window", () => {
    let now = 0;
    const limiter = new FailureLimiter(3, 1000, () => now);
    for (let i = 0; i < 3; i++) {
      expect(limiter.blocked("a")).toBe(false);
      limiter.fail("a");
      now += 100;
    }
    expect(limiter.blocked("a")).toBe(true);
    expect(limiter.blocked("b")).toBe(false);
    now = 1050; // the first failure (t=0) has left the window
    expect(limiter.blocked("a")).toBe(false);
  });
});
