"use client";

import { useId, useState, type FormEvent } from "react";
import { ApiError, apiFetch } from "@/lib/api-client";
import { readQuestion, SUGGESTED_PROMPT } from "./question-draft";
import type { FieldErrors } from "./scenario-draft-read";
import { QUESTION_CHOICES } from "./session-types";

const errorClass = "text-xs font-medium text-halt dark:text-red-300";

/** Ask the class a question with two to six choices; a new question replaces the open one. */
export function QuestionComposer({ sessionId, disabled, onAsked }: { sessionId: string; disabled: boolean; onAsked: () => void }) {
  const id = useId();
  const [prompt, setPrompt] = useState(SUGGESTED_PROMPT);
  const [choices, setChoices] = useState<string[]>(["", "", ""]);
  const [errors, setErrors] = useState<FieldErrors>({});
  const [problem, setProblem] = useState<string | null>(null);
  const [pending, setPending] = useState(false);

  async function onSubmit(event: FormEvent) {
    event.preventDefault();
    const { body, errors: found } = readQuestion(prompt, choices);
    setErrors(found);
    setProblem(null);
    if (!body) return;
    setPending(true);
    try {
      await apiFetch(`/api/class-sessions/${sessionId}/questions`, { method: "POST", json: body });
      setChoices(["", "", ""]);
      setErrors({});
      onAsked();
    } catch (error) {
      if (error instanceof ApiError) {
        setProblem(error.message);
        setErrors(error.fields);
      } else setProblem("The server could not be reached: the question was not asked.");
    } finally {
      setPending(false);
    }
  }

  const setChoice = (index: number, value: string) => setChoices((previous) => previous.map((c, i) => (i === index ? value : c)));
  return (
    <form onSubmit={onSubmit} noValidate className="space-y-3" aria-label="Ask the class" data-testid="question-composer">
      <div className="space-y-1">
        <label htmlFor={`${id}-prompt`} className="block text-sm font-medium">
          Question
        </label>
        <input
          id={`${id}-prompt`}
          className="field-input"
          value={prompt}
          onChange={(event) => setPrompt(event.target.value)}
          aria-invalid={errors.prompt ? true : undefined}
          aria-describedby={errors.prompt ? `${id}-prompt-error` : undefined}
        />
        {errors.prompt ? (
          <p id={`${id}-prompt-error`} role="alert" className={errorClass}>
            {errors.prompt}
          </p>
        ) : null}
      </div>
      <fieldset className="space-y-2">
        <legend className="text-sm font-medium">
          Choices{" "}
          <span className="font-normal text-chart-muted">
            ({QUESTION_CHOICES.min} to {QUESTION_CHOICES.max})
          </span>
        </legend>
        {choices.map((choice, index) => {
          const key = `choices.${index}`;
          return (
            <div key={index} className="space-y-1">
              <div className="flex items-center gap-2">
                <label htmlFor={`${id}-choice-${index}`} className="w-16 shrink-0 text-sm text-chart-muted">
                  Choice {index + 1}
                </label>
                <input
                  id={`${id}-choice-${index}`}
                  className="field-input"
                  value={choice}
                  onChange={(event) => setChoice(index, event.target.value)}
                  aria-invalid={errors[key] ? true : undefined}
                  aria-describedby={errors[key] ? `${id}-choice-${index}-error` : undefined}
                />
                {choices.length > QUESTION_CHOICES.min ? (
                  <button
                    type="button"
                    className="shrink-0 px-1 text-sm text-chart-muted hover:text-chart-ink"
                    onClick={() => setChoices((previous) => previous.filter((_, i) => i !== index))}
                    aria-label={`Remove choice ${index + 1}`}
                  >
                    Remove
                  </button>
                ) : null}
              </div>
              {errors[key] ? (
                <p id={`${id}-choice-${index}-error`} role="alert" className={`${errorClass} pl-[4.5rem]`}>
                  {errors[key]}
                </p>
              ) : null}
            </div>
          );
        })}
        {errors.choices ? (
          <p role="alert" className={errorClass}>
            {errors.choices}
          </p>
        ) : null}
        {choices.length < QUESTION_CHOICES.max ? (
          <button
            type="button"
            className="text-sm font-semibold text-lox-600 hover:underline dark:text-lox-300"
            onClick={() => setChoices((previous) => [...previous, ""])}
          >
            Add a choice
          </button>
        ) : null}
      </fieldset>
      {problem ? (
        <p role="alert" className="rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm">
          {problem}
        </p>
      ) : null}
      <button type="submit" className="btn-primary" disabled={pending || disabled} aria-busy={pending}>
        {pending ? "Asking…" : "Ask the class"}
      </button>
    </form>
  );
}
