/**
 * A stand-in for the one thing integration tests cannot get outside a running Next server:
 * the request (its session cookie and headers). Everything behind it — permissions, data,
 * PostgreSQL, mail — is the real code. The mocks themselves are in mock-next.ts.
 */
export interface FakeRequest {
  userId?: string;
  ip: string;
  saved: number;
  destroyed: number;
}

const g = globalThis as unknown as { __loxRequest?: FakeRequest };

export function fakeRequest(): FakeRequest {
  g.__loxRequest ??= { ip: "203.0.113.7", saved: 0, destroyed: 0 };
  return g.__loxRequest;
}

/** Make the following calls as this user (or anonymously with null). */
export function actAs(userId: string | null, ip = "203.0.113.7"): void {
  const request = fakeRequest();
  request.userId = userId ?? undefined;
  request.ip = ip;
}
