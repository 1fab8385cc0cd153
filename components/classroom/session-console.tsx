"use client";

import Link from "next/link";
import { useMemo, useState } from "react";
import { diagnose } from "@/geometry/verdict";
import { SafetyCautions } from "@/components/run/safety-cautions";
import { ConnectionBadge } from "./connection-badge";
import { PlaybackControls, useControl } from "./console-controls";
import { JoinCodePanel } from "./join-code-panel";
import { LiveView } from "./live-view";
import { SCENARIO_SENSOR_LABELS } from "./live-words";
import { QuestionComposer } from "./question-composer";
import type { SessionSnapshot } from "./session-types";
import { TallyPanel } from "./tally-panel";
import { useSessionStream } from "./use-session-stream";

function ClassroomControls({ snapshot, control }: { snapshot: SessionSnapshot; control: ReturnType<typeof useControl> }) {
  const { send, pending } = control;
  const [ending, setEnding] = useState(false);
  const ended = snapshot.status === "ended";
  return (
    <section className="card space-y-4 p-5" aria-labelledby="room-heading" data-testid="room-controls">
      <h2 id="room-heading" className="text-lg font-semibold">
        The room
      </h2>
      <div className="flex flex-wrap gap-2">
        <button
          type="button"
          className="btn-quiet"
          onClick={() => send(snapshot.frozen ? "unfreeze" : "freeze")}
          disabled={pending !== null || ended}
          aria-pressed={snapshot.frozen}
        >
          {snapshot.frozen ? "Unfreeze the screens" : "Freeze the screens"}
        </button>
        <button
          type="button"
          className="btn-quiet"
          onClick={() => send(snapshot.answerRevealed ? "hide" : "reveal")}
          disabled={pending !== null}
          aria-pressed={snapshot.answerRevealed}
        >
          {snapshot.answerRevealed ? "Hide the answer" : "Reveal the answer"}
        </button>
      </div>
      <p className="text-sm text-chart-muted">
        {snapshot.frozen
          ? "Every screen holds still until you unfreeze it; the capture does not move on."
          : "Freeze to talk over one moment of the capture."}
      </p>
      <div
        className="rounded-lg border border-chart-rule p-3 text-sm"
        data-testid="console-answer"
        data-revealed={snapshot.answerRevealed ? "true" : "false"}
      >
        <p className="font-semibold">{snapshot.answerRevealed ? "The class sees the answer:" : "The answer is hidden from the class."}</p>
        {snapshot.answer ? <p className="mt-1">{snapshot.answer}</p> : null}
      </div>
      {ended ? null : ending ? (
        <div
          role="group"
          aria-label="End the session?"
          className="flex flex-wrap items-center gap-2 rounded-lg border border-halt/40 bg-halt-soft p-3 text-sm"
        >
          <span>End the session for everyone? The capture so far is saved as a run.</span>
          <button
            type="button"
            className="btn-danger px-3 py-1"
            onClick={() => send("end")}
            disabled={pending !== null}
            aria-busy={pending === "end"}
          >
            {pending === "end" ? "Ending…" : "End the session"}
          </button>
          <button type="button" className="btn-quiet px-3 py-1" onClick={() => setEnding(false)}>
            Keep it going
          </button>
        </div>
      ) : (
        <button type="button" className="btn-quiet" onClick={() => setEnding(true)}>
          End the session…
        </button>
      )}
    </section>
  );
}

function EndedNotice({ slug, snapshot }: { slug: string; snapshot: SessionSnapshot }) {
  const runPath = snapshot.runPath ?? (snapshot.runId ? `/w/${slug}/runs/${snapshot.runId}` : null);
  return (
    <section className="card border-l-8 border-l-lox-500 p-5" aria-labelledby="ended-heading" data-testid="session-ended">
      <h2 id="ended-heading" className="text-lg font-semibold">
        The session has ended
      </h2>
      {runPath ? (
        <p className="mt-1 text-sm">
          Its capture is saved as a simulated run the class can reopen:{" "}
          <Link href={runPath} className="link" data-testid="saved-run-link">
            open the saved run
          </Link>
          .
        </p>
      ) : (
        <p className="mt-1 text-sm text-chart-muted">Saving its capture as a run…</p>
      )}
    </section>
  );
}

/**
 * The instructor's console: the join code and its QR code, playback, freeze and the answer,
 * the live view as every student sees it (with the likely causes, for the instructor), the
 * question composer and the live tally with each participant's answer.
 */
export function SessionConsole({ slug, sessionId }: { slug: string; sessionId: string }) {
  const stream = useSessionStream(sessionId, { host: true });
  const control = useControl(sessionId, stream.accept);
  const { snapshot } = stream;
  const diagnosis = useMemo(() => (snapshot ? diagnose(snapshot.live.checks) : []), [snapshot]);

  if (stream.refusal) {
    return (
      <p role="alert" className="rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm" data-testid="console-refused">
        {stream.refusal.status === 404 ? "There is no such session in this workspace." : stream.refusal.message}
      </p>
    );
  }
  if (!snapshot) return <p className="text-sm text-chart-muted">Connecting to the session…</p>;
  const ended = snapshot.status === "ended";

  return (
    <div className="space-y-6" data-testid="session-console" data-state-version={snapshot.stateVersion}>
      <header className="flex flex-wrap items-start justify-between gap-3">
        <div>
          <p className="text-sm text-chart-muted">
            <Link href={`/w/${slug}/classroom`} className="link">
              Classroom
            </Link>{" "}
            · console
          </p>
          <h2 className="text-2xl font-semibold">{snapshot.scenarioName}</h2>
          {snapshot.scenarioDescription ? <p className="max-w-prose text-chart-muted">{snapshot.scenarioDescription}</p> : null}
        </div>
        <div className="flex flex-wrap items-center gap-3 text-sm">
          <ConnectionBadge status={stream.status} attempt={stream.attempt} ended={ended} />
          <span data-testid="participant-count">
            {snapshot.participants} {snapshot.participants === 1 ? "participant" : "participants"}
          </span>
          <Link href={`/live/${sessionId}`} className="link" target="_blank">
            Open the class view
          </Link>
        </div>
      </header>

      {ended ? (
        <EndedNotice slug={slug} snapshot={snapshot} />
      ) : snapshot.joinCode ? (
        <JoinCodePanel joinCode={snapshot.joinCode} allowGuests={snapshot.allowGuests} />
      ) : null}
      {control.problem ? (
        <p role="alert" className="rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm">
          {control.problem}
        </p>
      ) : null}
      {snapshot.powersMotors ? <SafetyCautions /> : null}

      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="min-w-0 space-y-6">
          {ended ? null : <PlaybackControls snapshot={snapshot} control={control} />}
          {snapshot.frozen ? (
            <p className="rounded-lg border border-heed/40 bg-heed-soft px-3 py-2 text-sm font-medium" role="status">
              The screens are frozen.
            </p>
          ) : null}
          <LiveView live={snapshot.live} diagnosis={diagnosis} sensorLabels={SCENARIO_SENSOR_LABELS} />
        </div>
        <aside className="space-y-6" aria-label="Room and questions">
          <ClassroomControls snapshot={snapshot} control={control} />
          <section className="card space-y-4 p-5" aria-labelledby="questions-heading">
            <h2 id="questions-heading" className="text-lg font-semibold">
              Questions
            </h2>
            {ended ? null : <QuestionComposer sessionId={sessionId} disabled={ended} onAsked={stream.reloadTally} />}
            <TallyPanel sessionId={sessionId} tally={stream.tally} onChanged={stream.reloadTally} />
          </section>
        </aside>
      </div>
    </div>
  );
}
