/**
 * A sliding-window counter of failures per key (e.g. per client address), kept in this
 * process's memory. Good enough to slow down guessing on one server; sign-in, which must hold
 * across servers, keeps its attempts in PostgreSQL instead (lib/data/users.ts).
 */
export class FailureLimiter {
  private readonly failures = new Map<string, number[]>();

  constructor(
    private readonly limit: number,
    private readonly windowMs: number,
    private readonly now: () => number = Date.now,
  ) {}

  private recent(key: string): number[] {
    const since = this.now() - this.windowMs;
    const kept = (this.failures.get(key) ?? []).filter((t) => t > since);
    if (kept.length) this.failures.set(key, kept);
    else this.failures.delete(key);
    return kept;
  }

  blocked(key: string): boolean {
    return this.recent(key).length >= this.limit;
  }

  fail(key: string): void {
    const kept = this.recent(key);
    kept.push(this.now());
    this.failures.set(key, kept);
  }
}
