"use client";

import Link from "next/link";
import { useMemo } from "react";
import { diagnose } from "@/geometry/verdict";
import { SafetyCautions } from "@/components/run/safety-cautions";
import { ConnectionBadge } from "./connection-badge";
import { LiveView } from "./live-view";
import { SCENARIO_SENSOR_LABELS, speedWords } from "./live-words";
import { QuestionCard } from "./question-card";
import { useSessionStream } from "./use-session-stream";

/**
 * A participant's screen: the capture as it plays, the instructor's question, the answer once
 * revealed, and word when the screen is frozen or the connection has dropped. Likely causes are
 * held back until the answer is revealed, so the class works the fault out from the checks.
 */
export function LiveViewer({ sessionId, signedIn }: { sessionId: string; signedIn: boolean }) {
  const stream = useSessionStream(sessionId);
  const { snapshot } = stream;
  const diagnosis = useMemo(() => (snapshot?.answerRevealed ? diagnose(snapshot.live.checks) : null), [snapshot]);

  if (stream.refusal) {
    const notJoined = stream.refusal.status === 401 || stream.refusal.status === 403;
    return (
      <div className="mx-auto max-w-md space-y-4" data-testid="viewer-refused">
        <h1 className="text-2xl font-semibold">{notJoined ? "Join the session first" : "No such session"}</h1>
        <p className="text-chart-muted">
          {notJoined ? "This screen follows a class session once you have joined it with its code." : stream.refusal.message}
        </p>
        <p className="flex flex-wrap gap-3">
          <Link href="/join" className="btn-primary">
            Join with a code
          </Link>
          {!signedIn ? (
            <Link href={`/sign-in?next=${encodeURIComponent(`/live/${sessionId}`)}`} className="btn-quiet">
              Sign in
            </Link>
          ) : null}
        </p>
      </div>
    );
  }
  if (!snapshot) {
    return (
      <p className="text-sm text-chart-muted" role="status">
        Connecting to the session…
      </p>
    );
  }
  const ended = snapshot.status === "ended";

  return (
    <article className="space-y-6" data-testid="live-viewer" data-state-version={snapshot.stateVersion}>
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <h1 className="text-2xl font-semibold">{snapshot.scenarioName}</h1>
          {snapshot.scenarioDescription ? <p className="max-w-prose text-chart-muted">{snapshot.scenarioDescription}</p> : null}
        </div>
        <div className="flex flex-wrap items-center gap-3 text-sm">
          <ConnectionBadge status={stream.status} attempt={stream.attempt} ended={ended} />
          <span className="text-chart-muted" data-testid="viewer-playback">
            {ended
              ? "Ended"
              : snapshot.frozen
                ? "Frozen"
                : snapshot.playing
                  ? `Playing at ${speedWords(snapshot.speed)}`
                  : snapshot.status === "waiting"
                    ? "Not started yet"
                    : "Paused"}
          </span>
        </div>
      </header>

      {stream.status === "reconnecting" && !ended ? (
        <p className="rounded-lg border border-heed/40 bg-heed-soft px-3 py-2 text-sm" role="status" data-testid="reconnecting">
          The connection dropped. Reconnecting… the screen catches up as soon as it is back.
        </p>
      ) : null}
      {ended ? (
        <section className="card border-l-8 border-l-lox-500 p-5" data-testid="viewer-ended">
          <h2 className="text-lg font-semibold">The session has ended</h2>
          {snapshot.runPath ? (
            <p className="mt-1 text-sm">
              Its capture is saved as a run:{" "}
              <Link href={snapshot.runPath} className="link">
                reopen it on the run page
              </Link>
              .
            </p>
          ) : (
            <p className="mt-1 text-sm text-chart-muted">What you see below is where the capture stopped.</p>
          )}
        </section>
      ) : null}
      {snapshot.frozen && !ended ? (
        <p className="rounded-lg border border-heed/40 bg-heed-soft px-4 py-3 font-semibold" role="status" data-testid="frozen-notice">
          The instructor has frozen the screen to talk it over.
        </p>
      ) : null}
      {snapshot.powersMotors ? <SafetyCautions /> : null}
      {snapshot.answerRevealed && snapshot.answer ? (
        <section className="card border-l-8 border-l-lox-500 p-5" aria-labelledby="answer-heading" data-testid="revealed-answer">
          <h2 id="answer-heading" className="text-xs font-semibold uppercase tracking-widest text-lox-600 dark:text-lox-300">
            The answer
          </h2>
          <p className="mt-1 text-lg">{snapshot.answer}</p>
        </section>
      ) : null}
      {snapshot.question ? (
        <QuestionCard key={snapshot.question.id} sessionId={sessionId} question={snapshot.question} asHost={snapshot.role === "host"} />
      ) : null}
      <LiveView live={snapshot.live} diagnosis={diagnosis} sensorLabels={SCENARIO_SENSOR_LABELS} />
    </article>
  );
}
