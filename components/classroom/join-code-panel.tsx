"use client";

import { useMemo, useSyncExternalStore } from "react";
import { QR_QUIET_ZONE, qrSymbol } from "./qr-symbol";

const noSubscription = () => () => undefined;

/** This page's origin in the browser; empty during the server render. */
function useOrigin(): string {
  return useSyncExternalStore(
    noSubscription,
    () => window.location.origin,
    () => "",
  );
}

/** The join code as big as a projector needs, its QR code, and the address to type. */
export function JoinCodePanel({ joinCode, allowGuests }: { joinCode: string; allowGuests: boolean }) {
  const origin = useOrigin();
  const joinUrl = `${origin}/join?code=${encodeURIComponent(joinCode)}`;
  const symbol = useMemo(() => (origin ? qrSymbol(joinUrl) : null), [origin, joinUrl]);
  const side = symbol ? symbol.size + 2 * QR_QUIET_ZONE : 0;
  return (
    <section className="card flex flex-wrap items-center gap-6 p-5" aria-labelledby="join-code-heading" data-testid="join-panel">
      <div className="min-w-0 flex-1 space-y-2">
        <h2 id="join-code-heading" className="text-sm font-semibold uppercase tracking-widest text-chart-muted">
          Join code
        </h2>
        <p
          className="font-mono text-5xl font-bold tracking-[0.3em] sm:text-6xl"
          data-testid="join-code"
          aria-label={`Join code ${joinCode.split("").join(" ")}`}
        >
          {joinCode}
        </p>
        <p className="text-sm">
          Students open <span className="font-mono font-semibold">{origin ? `${origin.replace(/^https?:\/\//, "")}/join` : "/join"}</span>{" "}
          and type the code, or scan the square.
        </p>
        <p className="text-xs text-chart-muted">
          {allowGuests
            ? "Guests may join with a display name, without an account."
            : "Only members of this workspace may join: students sign in first."}{" "}
          The code expires four hours after your last action.
        </p>
      </div>
      {symbol ? (
        <svg
          viewBox={`${-QR_QUIET_ZONE} ${-QR_QUIET_ZONE} ${side} ${side}`}
          className="h-44 w-44 shrink-0 rounded-lg bg-white"
          shapeRendering="crispEdges"
          role="img"
          aria-label={`QR code that opens ${joinUrl}`}
          data-testid="join-qr"
        >
          <rect x={-QR_QUIET_ZONE} y={-QR_QUIET_ZONE} width={side} height={side} fill="#fff" />
          <path d={symbol.path} fill="#000" />
        </svg>
      ) : (
        <div className="h-44 w-44 shrink-0 animate-pulse rounded-lg bg-chart-paper" aria-hidden />
      )}
    </section>
  );
}
