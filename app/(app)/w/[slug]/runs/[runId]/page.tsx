import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { CheckList } from "@/components/run/check-list";
import { Comparison } from "@/components/run/comparison";
import { figuresOf } from "@/components/run/comparison-figures";
import { ParametersTable } from "@/components/run/parameters-table";
import { SafetyCautions } from "@/components/run/safety-cautions";
import { VerdictBanner } from "@/components/run/verdict-banner";
import { ExportsMenu } from "@/components/run-actions/exports-menu";
import { PrintButton } from "@/components/run-actions/print-button";
import { PrintHeader } from "@/components/run-actions/print-header";
import { ReprocessForm } from "@/components/run-actions/reprocess-form";
import { RunProgress } from "@/components/run-actions/run-progress";
import { SignOffForm } from "@/components/run-actions/sign-off-form";
import { VersionList } from "@/components/run-actions/version-list";
import { RunViewPanel } from "@/components/run-actions/run-view-panel";
import { getRunPageData } from "@/lib/data/run-page";
import { listSites } from "@/lib/data/sites";
import { requireWorkspacePage } from "@/lib/guard";
import { MODEL_CHOICE_LABELS } from "@/lib/fleet-terms";
import { isRecordId } from "@/lib/ids";

export const metadata: Metadata = { title: "Calibration run" };

export default async function RunPage({
  params,
  searchParams,
}: {
  params: Promise<{ slug: string; runId: string }>;
  searchParams: Promise<{ version?: string }>;
}) {
  const [{ slug, runId }, { version: versionParam }] = await Promise.all([params, searchParams]);
  const { access, can } = await requireWorkspacePage(slug, "run.view");
  if (!isRecordId(runId)) notFound();
  const data = await getRunPageData(access.workspace.id, runId, versionParam && isRecordId(versionParam) ? versionParam : undefined);
  // A run not shared with students does not exist for them.
  if (!data || !can("run.view", { createdById: data.run.uploadedById, sharedWithStudents: data.run.sharedWithStudents })) notFound();
  const { run, version, analysis, view, previous } = data;
  const sensorLabels = Object.fromEntries(run.sensors.map((s) => [s.slot, s.label]));
  const apiBase = `/api/workspaces/${slug}/runs/${run.id}`;
  const signedThis = Boolean(version && run.signedOffVersionId === version.id);
  const isCurrent = version?.id === run.currentVersionId;
  const mayEdit = can("run.edit", { createdById: run.uploadedById });
  const sites = mayEdit ? (await listSites(access.workspace.id)).map((s) => ({ id: s.id, name: s.name })) : [];
  const firstCompass = analysis?.magnetometers[0] ?? null;
  const previousCompass = previous?.analysis.magnetometers.find((m) => m.sensor === previous.slot) ?? null;

  return (
    <article className="space-y-6 print:space-y-3" data-testid="run-page">
      <PrintHeader run={run} version={version} verdict={analysis?.verdict ?? null} workspaceName={access.workspace.name} />

      <header className="flex flex-wrap items-start justify-between gap-4 print:hidden">
        <div>
          <p className="text-sm text-chart-muted">
            <Link href={`/w/${slug}/runs`} className="link">
              Runs
            </Link>{" "}
            ·{" "}
            <Link href={`/w/${slug}/vehicles/${run.vehicleId}`} className="link">
              {run.vehicleName}
            </Link>
          </p>
          <h2 className="text-2xl font-semibold">{run.title || run.fileName}</h2>
          <p className="text-sm text-chart-muted">
            Captured {run.capturedOn}
            {run.site
              ? ` at ${run.site.name} (${run.site.latitudeDeg.toFixed(3)}°, ${run.site.longitudeDeg.toFixed(3)}°, ${run.site.altitudeM} m)`
              : " · no site given"}{" "}
            · uploaded by {run.uploadedByName ?? "someone"}
            {run.simulated ? " · simulated data" : ""}
          </p>
        </div>
        {version ? (
          <p className="rounded-full border border-chart-rule px-3 py-1 text-xs text-chart-muted">
            Version {version.number} · {MODEL_CHOICE_LABELS[version.modelChoice]}
            {isCurrent ? "" : " · an earlier version"}
          </p>
        ) : null}
      </header>

      {run.powersMotors ? <SafetyCautions vehicleKind={run.vehicleKind} /> : null}

      {!analysis ? (
        <RunProgress apiBase={apiBase} initial={{ status: run.status, progress: run.progress, stage: run.stage, error: run.error }} />
      ) : (
        <>
          <VerdictBanner
            verdict={analysis.verdict}
            verdictSummary={analysis.verdictSummary}
            diagnosis={analysis.diagnosis}
            checks={analysis.checks}
            sensorLabels={sensorLabels}
            vehicleKind={run.vehicleKind}
          />
          <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem] print:block">
            <div className="min-w-0 space-y-6">
              {view ? (
                <RunViewPanel view={view} sensorLabels={sensorLabels} gravityMps2={analysis.reference.gravityMps2} />
              ) : (
                <p className="card p-5 text-sm text-chart-muted">No drawing data was kept for this version.</p>
              )}
            </div>
            <aside className="space-y-4 print:hidden" aria-label="Actions">
              <section className="card space-y-3 p-5" aria-labelledby="sign-off-heading" data-testid="sign-off">
                <h2 id="sign-off-heading" className="text-lg font-semibold">
                  Sign-off
                </h2>
                {signedThis ? (
                  <div className="rounded-lg border border-steady/40 bg-steady-soft p-3 text-sm" data-testid="signed-off">
                    <p className="font-semibold">
                      Signed off by {run.signedOffByName ?? "a technician"} on {run.signedOffAt?.slice(0, 16).replace("T", " ")} UTC
                    </p>
                    {run.signOffComment ? <p className="mt-1">“{run.signOffComment}”</p> : null}
                    <p className="mt-1 text-xs text-chart-muted">This version is locked: processing again makes a new version.</p>
                  </div>
                ) : run.signedOffVersionId ? (
                  <p className="text-sm text-chart-muted">
                    Version {run.versions.find((v) => v.id === run.signedOffVersionId)?.number} of this run is signed off; this one is not.
                  </p>
                ) : null}
                {!signedThis && can("run.sign-off") && isCurrent && version ? (
                  <SignOffForm workspace={slug} runId={run.id} versionId={version.id} verdict={analysis.verdict} />
                ) : !signedThis && !can("run.sign-off") ? (
                  <p className="text-sm text-chart-muted" data-testid="sign-off-not-allowed">
                    A technician or an owner signs off calibrations.
                  </p>
                ) : null}
              </section>
              {version ? (
                <section className="card space-y-3 p-5" aria-labelledby="export-heading">
                  <h2 id="export-heading" className="text-lg font-semibold">
                    Take it away
                  </h2>
                  <ExportsMenu base={apiBase} versionId={version.id} />
                  <PrintButton />
                </section>
              ) : null}
              {mayEdit ? (
                <section className="card space-y-3 p-5" aria-labelledby="reprocess-heading">
                  <h2 id="reprocess-heading" className="text-lg font-semibold">
                    Process again
                  </h2>
                  <ReprocessForm
                    apiBase={apiBase}
                    sites={sites}
                    currentModel={version?.modelChoice ?? "auto"}
                    currentSiteId={run.site?.siteId ?? null}
                    signedOff={Boolean(run.signedOffVersionId)}
                  />
                </section>
              ) : null}
              <VersionList versions={run.versions} currentId={version?.id ?? null} signedOffId={run.signedOffVersionId} />
            </aside>
          </div>
          <CheckList checks={analysis.checks} sensorLabels={sensorLabels} />
          <ParametersTable
            magnetometers={analysis.magnetometers}
            accelerometers={analysis.accelerometers ?? (analysis.accelerometer ? [analysis.accelerometer] : [])}
            gyroscopes={analysis.gyroscopes}
            expectedField={analysis.reference.magnetic}
            units={analysis.units}
            sensorLabels={sensorLabels}
          />
          {firstCompass ? (
            <div className="print:hidden">
              <Comparison
                current={figuresOf(firstCompass, { capturedOn: run.capturedOn, title: run.title })}
                previous={
                  previousCompass ? figuresOf(previousCompass, { capturedOn: previous!.run.capturedOn, title: previous!.run.title }) : null
                }
                previousHref={previous ? `/w/${slug}/runs/${previous.run.id}` : null}
                sensorName={
                  sensorLabels[firstCompass.sensor] ? `${firstCompass.sensor} · ${sensorLabels[firstCompass.sensor]}` : firstCompass.sensor
                }
              />
            </div>
          ) : null}
          {analysis.notes.length ? (
            <section className="card p-5 text-sm print:hidden" aria-labelledby="notes-heading">
              <h2 id="notes-heading" className="text-lg font-semibold">
                Notes from the analysis
              </h2>
              <ul className="mt-2 list-disc space-y-1 pl-5">
                {analysis.notes.map((note) => (
                  <li key={note}>{note}</li>
                ))}
              </ul>
            </section>
          ) : null}
          <footer className="hidden print:mt-6 print:block print:text-xs">
            <div className="grid grid-cols-2 gap-8">
              <p className="border-t border-chart-ink pt-1">Technician: {signedThis ? run.signedOffByName : ""}</p>
              <p className="border-t border-chart-ink pt-1">Date: {signedThis ? run.signedOffAt?.slice(0, 10) : ""}</p>
            </div>
          </footer>
        </>
      )}
    </article>
  );
}
