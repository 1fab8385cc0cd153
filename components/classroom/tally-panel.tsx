"use client";

import { useState } from "react";
import { ApiError, apiFetch } from "@/lib/api-client";
import type { Tally, TallyQuestion } from "./session-types";
import { answerCountWords, answerList, tallyRows } from "./tally-rows";

function QuestionTally({
  sessionId,
  question,
  latest,
  onClosed,
}: {
  sessionId: string;
  question: TallyQuestion;
  latest: boolean;
  onClosed: () => void;
}) {
  const [pending, setPending] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const rows = tallyRows(question);
  const answers = answerList(question);

  async function close() {
    setPending(true);
    setProblem(null);
    try {
      await apiFetch(`/api/class-sessions/${sessionId}/questions/${question.id}/close`, { method: "POST" });
      onClosed();
    } catch (error) {
      setProblem(error instanceof ApiError ? error.message : "The server could not be reached.");
    } finally {
      setPending(false);
    }
  }

  return (
    <li
      className="space-y-3 rounded-lg border border-chart-rule p-4"
      data-testid="tally-question"
      data-question={question.id}
      data-open={question.open ? "true" : "false"}
    >
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <p className="font-semibold">{question.prompt}</p>
          <p className="text-xs text-chart-muted" data-testid="tally-count">
            {answerCountWords(question)} · {question.open ? "open" : "closed"}
          </p>
        </div>
        {question.open ? (
          <button type="button" className="btn-quiet px-3 py-1" onClick={close} disabled={pending} aria-busy={pending}>
            {pending ? "Closing…" : "Close answers"}
          </button>
        ) : null}
      </div>
      {problem ? (
        <p role="alert" className="text-xs font-medium text-halt dark:text-red-300">
          {problem}
        </p>
      ) : null}
      <ol className="space-y-2">
        {rows.map((row) => (
          <li key={row.index} data-testid="tally-row" data-count={row.count}>
            <div className="flex items-baseline justify-between gap-3 text-sm">
              <span>
                <span className="mr-1.5 font-mono text-chart-muted">{String.fromCharCode(65 + row.index)}</span>
                {row.choice}
              </span>
              <span className="shrink-0 font-mono tabular-nums">
                {row.count} <span className="text-chart-muted">({Math.round(row.share * 100)}%)</span>
              </span>
            </div>
            <div className="mt-1 h-2.5 overflow-hidden rounded-full bg-chart-paper ring-1 ring-inset ring-chart-rule" aria-hidden>
              <div className="h-full bg-brass-400 transition-[width] duration-300" style={{ width: `${row.share * 100}%` }} />
            </div>
          </li>
        ))}
      </ol>
      {latest || answers.length ? (
        <details className="text-sm" open={latest}>
          <summary className="cursor-pointer text-chart-muted">Each answer ({answers.length})</summary>
          {answers.length ? (
            <table className="mt-2 w-full text-left text-sm" aria-label={`Answers to “${question.prompt}”`}>
              <thead className="text-xs uppercase tracking-wide text-chart-muted">
                <tr>
                  <th scope="col" className="py-1 font-medium">
                    Participant
                  </th>
                  <th scope="col" className="py-1 font-medium">
                    Answer
                  </th>
                </tr>
              </thead>
              <tbody className="divide-y divide-chart-rule">
                {answers.map((a, index) => (
                  <tr key={`${index}-${a.participant}`} data-testid="tally-answer">
                    <td className="py-1 pr-3">{a.participant}</td>
                    <td className="py-1">{a.choice}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          ) : (
            <p className="mt-1 text-chart-muted">Nobody has answered yet.</p>
          )}
        </details>
      ) : null}
    </li>
  );
}

/** Every question asked in this session, newest first, with the live tally and each participant's answer. */
export function TallyPanel({ sessionId, tally, onChanged }: { sessionId: string; tally: Tally | null; onChanged: () => void }) {
  if (!tally) return <p className="text-sm text-chart-muted">Loading the answers…</p>;
  if (tally.questions.length === 0) return <p className="text-sm text-chart-muted">No question asked yet.</p>;
  const newestFirst = [...tally.questions].reverse();
  return (
    <ul className="space-y-3" data-testid="tally">
      {newestFirst.map((question, index) => (
        <QuestionTally key={question.id} sessionId={sessionId} question={question} latest={index === 0} onClosed={onChanged} />
      ))}
    </ul>
  );
}
