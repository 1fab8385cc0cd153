"use client";

import Link from "next/link";
import { useRouter } from "next/navigation";
import { useMemo, useState, type FormEvent } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { ApiError, apiFetch } from "@/lib/api-client";
import { FieldShell } from "@/components/ui/field";
import { draftFromScenario, draftPart, shownFieldKey, type ScenarioDraft } from "./scenario-draft";
import { readScenarioBody, readScenarioSpec, SCENARIO_LIMITS, type FieldErrors } from "./scenario-draft-read";
import { FaultSections } from "./scenario-fault-sections";
import { fieldId } from "./scenario-fields";
import { expectedField } from "./scenario-preview-compute";
import { ScenarioPreview } from "./scenario-preview";
import { CompassSection, PathSection, SiteSection } from "./scenario-sections";
import { ScenarioActions } from "./scenario-actions";
import type { ScenarioItem } from "./session-types";

/** A message from the server, kept while the part of the form it is about stays as it was sent. */
type ServerErrors = Record<string, { message: string; sentAs: string }>;

const WORD_FIELDS = ["name", "description", "answer"] as const;

/**
 * Compose a simulated capture with the faults to teach, see it at once as the class will, and
 * save it. The spec's fields are checked as they are typed (the preview needs them); the
 * words once left or on saving; the server's own messages land on the same fields.
 */
export function ScenarioBuilder({ slug, scenario, notice }: { slug: string; scenario: ScenarioItem | null; notice?: string | null }) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const initial = useMemo(
    () =>
      draftFromScenario(scenario?.spec, {
        name: scenario?.name ?? "",
        description: scenario?.description ?? "",
        answer: scenario?.answer ?? "",
      }),
    [scenario],
  );
  const [draft, setDraft] = useState<ScenarioDraft>(initial);
  const [saved, setSaved] = useState<ScenarioDraft>(initial);
  const [touched, setTouched] = useState<Set<string>>(new Set());
  const [submitted, setSubmitted] = useState(false);
  const [server, setServer] = useState<ServerErrors>({});
  const [problem, setProblem] = useState<string | null>(null);
  const [note, setNote] = useState<string | null>(notice ?? null);
  const [pending, setPending] = useState(false);

  const update = (change: (d: ScenarioDraft) => void) =>
    setDraft((previous) => {
      const next = structuredClone(previous);
      change(next);
      return next;
    });

  const { spec } = useMemo(() => readScenarioSpec(draft), [draft]);
  const clientErrors = useMemo(() => readScenarioBody(draft).errors, [draft]);
  const errors: FieldErrors = {};
  const unplaced: string[] = [];
  for (const [key, { message, sentAs }] of Object.entries(server)) {
    if (draftPart(draft, key) !== sentAs) continue;
    const shown = shownFieldKey(key);
    if (shown) errors[shown] = message;
    else unplaced.push(key === "body" || key === "spec" ? message : `${key}: ${message}`);
  }
  for (const [key, message] of Object.entries(clientErrors)) {
    const isWords = (WORD_FIELDS as readonly string[]).includes(key);
    if (!isWords || submitted || touched.has(key)) errors[key] = message;
  }
  const dirty = JSON.stringify(draft) !== JSON.stringify(saved);
  const reference = spec ? expectedField(spec.site, spec.date) : null;

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    setSubmitted(true);
    setNote(null);
    const { body, errors: found } = readScenarioBody(draft);
    if (!body) {
      setProblem("Some fields need attention.");
      document.getElementById(fieldId(Object.keys(found)[0]))?.focus();
      return;
    }
    setPending(true);
    setProblem(null);
    try {
      const url = scenario ? `/api/workspaces/${slug}/scenarios/${scenario.id}` : `/api/workspaces/${slug}/scenarios`;
      const reply = await apiFetch<{ scenario: ScenarioItem }>(url, { method: scenario ? "PATCH" : "POST", json: body });
      setServer({});
      await queryClient.invalidateQueries({ queryKey: ["scenarios", slug] });
      if (scenario) {
        queryClient.setQueryData(["scenario", slug, scenario.id], reply);
        setSaved(draft);
        setNote(`${reply.scenario.name} saved.`);
      } else {
        router.push(`/w/${slug}/classroom/scenarios/${reply.scenario.id}?saved=1`);
      }
    } catch (error) {
      if (error instanceof ApiError) {
        setProblem(error.message);
        setServer(
          Object.fromEntries(Object.entries(error.fields).map(([key, message]) => [key, { message, sentAs: draftPart(draft, key) }])),
        );
      } else {
        setProblem("The server could not be reached. Check the connection and try again.");
      }
    } finally {
      setPending(false);
    }
  }

  const touch = (key: string) => setTouched((previous) => new Set(previous).add(key));

  return (
    <div className="grid gap-6 xl:grid-cols-[28rem_minmax(0,1fr)]">
      <form
        onSubmit={onSubmit}
        noValidate
        className="space-y-5"
        aria-label={scenario ? `Edit ${scenario.name}` : "Compose a scenario"}
        data-testid="scenario-form"
      >
        {problem || unplaced.length ? (
          <div role="alert" className="rounded-lg border border-halt/30 bg-halt-soft px-3 py-2 text-sm">
            {problem ? <p>{problem}</p> : null}
            {unplaced.length ? (
              <ul className="mt-1 list-disc pl-5">
                {unplaced.map((line) => (
                  <li key={line}>{line}</li>
                ))}
              </ul>
            ) : null}
          </div>
        ) : null}
        {note ? (
          <p role="status" className="rounded-lg border border-steady/30 bg-steady-soft px-3 py-2 text-sm">
            {note}
          </p>
        ) : null}

        <fieldset className="space-y-4 rounded-lg border border-chart-rule p-4">
          <legend className="px-1 font-display text-base font-semibold">For the class</legend>
          <FieldShell id={fieldId("name")} label="Name" error={errors.name}>
            <input
              id={fieldId("name")}
              className="field-input"
              value={draft.name}
              maxLength={SCENARIO_LIMITS.name + 20}
              onChange={(event) => update((d) => void (d.name = event.target.value))}
              onBlur={() => touch("name")}
              aria-invalid={errors.name ? true : undefined}
              aria-describedby={errors.name ? `${fieldId("name")}-error` : undefined}
            />
          </FieldShell>
          <FieldShell
            id={fieldId("description")}
            label="What the class is told"
            error={errors.description}
            hint="Shown on every screen from the start."
          >
            <textarea
              id={fieldId("description")}
              rows={2}
              className="field-input"
              value={draft.description}
              onChange={(event) => update((d) => void (d.description = event.target.value))}
              onBlur={() => touch("description")}
              aria-invalid={errors.description ? true : undefined}
              aria-describedby={errors.description ? `${fieldId("description")}-error` : `${fieldId("description")}-hint`}
            />
          </FieldShell>
          <FieldShell
            id={fieldId("answer")}
            label="The answer: what is wrong, in words"
            error={errors.answer}
            hint="Students see it only when you reveal it during a session."
          >
            <textarea
              id={fieldId("answer")}
              rows={3}
              className="field-input"
              value={draft.answer}
              onChange={(event) => update((d) => void (d.answer = event.target.value))}
              onBlur={() => touch("answer")}
              aria-invalid={errors.answer ? true : undefined}
              aria-describedby={errors.answer ? `${fieldId("answer")}-error` : `${fieldId("answer")}-hint`}
            />
          </FieldShell>
        </fieldset>

        <SiteSection draft={draft} update={update} errors={errors} />
        <PathSection draft={draft} update={update} errors={errors} />
        <CompassSection draft={draft} update={update} errors={errors} />
        <div className="space-y-2">
          <h3 className="font-display text-base font-semibold">Faults to add</h3>
          <FaultSections
            draft={draft}
            update={update}
            errors={errors}
            fieldStrengthMicrotesla={reference?.fieldStrengthMicrotesla ?? null}
          />
        </div>

        <div className="sticky bottom-0 -mx-1 flex flex-wrap items-center gap-3 border-t border-chart-rule bg-chart-paper/95 px-1 py-3 backdrop-blur">
          <button type="submit" className="btn-primary" disabled={pending} aria-busy={pending}>
            {pending ? "Saving…" : scenario ? "Save the scenario" : "Save the new scenario"}
          </button>
          {scenario ? <ScenarioActions slug={slug} scenario={scenario} dirty={dirty} /> : null}
          <Link href={`/w/${slug}/classroom`} className="btn-quiet">
            Back to the classroom
          </Link>
          <span className="text-xs text-chart-muted" aria-live="polite">
            {dirty ? "Unsaved changes" : scenario ? "All changes saved" : ""}
          </span>
        </div>
      </form>
      <div className="min-w-0">
        <ScenarioPreview spec={spec} />
      </div>
    </div>
  );
}
