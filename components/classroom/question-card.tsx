"use client";

import { useState } from "react";
import { ApiError, apiFetch } from "@/lib/api-client";
import type { SessionQuestion } from "./session-types";

/**
 * The instructor's question, answered with one click; a click on another choice changes the
 * answer while the question is open. The choice shows at once and is confirmed by the server.
 */
export function QuestionCard({ sessionId, question, asHost = false }: { sessionId: string; question: SessionQuestion; asHost?: boolean }) {
  // Keyed by question, so a new question starts with no local choice.
  const [sent, setSent] = useState<{ questionId: string; choice: number } | null>(null);
  const [pending, setPending] = useState<number | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const mine = sent?.questionId === question.id ? sent.choice : question.myChoice;

  async function answer(choice: number) {
    setPending(choice);
    setProblem(null);
    try {
      await apiFetch(`/api/class-sessions/${sessionId}/answers`, { method: "POST", json: { questionId: question.id, choice } });
      setSent({ questionId: question.id, choice });
    } catch (error) {
      setProblem(error instanceof ApiError ? error.message : "The server could not be reached: your answer was not sent.");
    } finally {
      setPending(null);
    }
  }

  return (
    <section
      className="card border-l-8 border-l-brass-400 p-5"
      aria-labelledby="question-heading"
      data-testid="question-card"
      data-question={question.id}
      data-open={question.open ? "true" : "false"}
    >
      <p className="text-xs font-semibold uppercase tracking-widest text-brass-600 dark:text-brass-300">
        {question.open ? "Question" : "Question · answers closed"}
      </p>
      <h2 id="question-heading" className="mt-1 text-xl font-semibold">
        {question.prompt}
      </h2>
      <div className="mt-3 grid gap-2 sm:grid-cols-2" role="group" aria-labelledby="question-heading">
        {question.choices.map((choice, index) => {
          const chosen = mine === index;
          return (
            <button
              key={index}
              type="button"
              className={`flex items-center gap-3 rounded-lg border px-4 py-3 text-left text-sm font-medium transition disabled:cursor-not-allowed ${
                chosen
                  ? "border-lox-600 bg-lox-600 text-white dark:border-lox-300 dark:bg-lox-300 dark:text-lox-950"
                  : "border-chart-rule bg-chart-sheet hover:border-lox-400 disabled:opacity-70"
              }`}
              onClick={() => answer(index)}
              disabled={asHost || !question.open || pending !== null}
              aria-pressed={chosen}
              data-choice={index}
            >
              <span className="font-mono" aria-hidden>
                {String.fromCharCode(65 + index)}
              </span>
              <span className="flex-1">{choice}</span>
              {chosen ? <span className="text-xs font-semibold">Your answer</span> : null}
            </button>
          );
        })}
      </div>
      <p className="mt-2 text-xs text-chart-muted" role="status" aria-live="polite" data-testid="answer-status">
        {asHost
          ? "The class answers here; the tally is on your console."
          : pending !== null
            ? "Sending your answer…"
            : mine !== null
              ? question.open
                ? `You answered ${String.fromCharCode(65 + mine)}. You may change it until the instructor closes the question.`
                : `You answered ${String.fromCharCode(65 + mine)}.`
              : question.open
                ? "Pick one answer."
                : "The question closed before you answered."}
      </p>
      {problem ? (
        <p role="alert" className="mt-1 text-xs font-medium text-halt dark:text-red-300">
          {problem}
        </p>
      ) : null}
    </section>
  );
}
