/**
 * `npm run fit`: runs the compiled command line (dist/cli/fit.mjs) in this process, building
 * it first when it is missing or older than any file it was built from. The check is a stat
 * per source file, a few milliseconds; a build takes a fraction of a second.
 *
 * `npm run fit` starts node with two V8 settings that suit one short, numeric run (measured by
 * bench/cli-bench.ts, about a fifth off a 1,000,000-sample file): feedback vectors allocated at
 * a function's first call rather than its eighth (--no-lazy-feedback-allocation), so the hot
 * loops are optimised sooner, and a 32 MiB young generation (--max-semi-space-size=32), so the
 * large typed arrays of a long capture are collected less often.
 */
import { readFileSync, statSync } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
// Kept in step with scripts/build-cli.mjs, which is only loaded when a build is needed.
const CLI_BUNDLE = path.join(ROOT, "dist/cli/fit.mjs");
const CLI_INPUTS = path.join(ROOT, "dist/cli/fit.inputs.json");
const CLI_BUILD_FILES = ["scripts/build-cli.mjs", "tsconfig.json", "package-lock.json", "node_modules/.package-lock.json"];

function modifiedMs(file) {
  return statSync(file, { throwIfNoEntry: false })?.mtimeMs ?? null;
}

function isStale() {
  const built = modifiedMs(CLI_BUNDLE);
  if (built === null) return true;
  let inputs;
  try {
    inputs = JSON.parse(readFileSync(CLI_INPUTS, "utf8")).inputs;
  } catch {
    return true;
  }
  for (const input of inputs) {
    const modified = modifiedMs(path.join(ROOT, input));
    // A source that is gone or newer: rebuild (and let the build say what is missing).
    if (modified === null || modified > built) return true;
  }
  return CLI_BUILD_FILES.some((file) => (modifiedMs(path.join(ROOT, file)) ?? 0) > built);
}

if (isStale()) {
  const { buildCli } = await import("./build-cli.mjs");
  try {
    await buildCli();
  } catch {
    // esbuild has already printed what is wrong.
    process.exit(1);
  }
}
await import(pathToFileURL(CLI_BUNDLE).href);
