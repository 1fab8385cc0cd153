/**
 * Builds the command line into one JavaScript file run by plain `node`: scripts/fit.ts and
 * everything it imports (the geometry, the ingest, its few packages) bundled by esbuild into
 * dist/cli/fit.mjs, with dist/cli/fit.inputs.json listing the files it was built from so that
 * scripts/fit.mjs can tell in a few stats whether it is out of date.
 *
 *   node scripts/build-cli.mjs      (also part of `npm run build`)
 */
import { mkdirSync, renameSync, utimesSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
export const CLI_ENTRY = "scripts/fit.ts";
export const CLI_BUNDLE = "dist/cli/fit.mjs";
export const CLI_INPUTS = "dist/cli/fit.inputs.json";
/** Files besides the bundle's inputs whose change means a rebuild (how it is built, which packages). */
export const CLI_BUILD_FILES = ["scripts/build-cli.mjs", "tsconfig.json", "package-lock.json", "node_modules/.package-lock.json"];

/** Writes a file whole or not at all, so that a second build at the same time cannot leave half of one. */
function writeAtomically(file, contents) {
  const temporary = `${file}.${process.pid}.tmp`;
  writeFileSync(temporary, contents);
  renameSync(temporary, file);
}

/**
 * Bundles the command line. Packages are bundled too: one file loads faster than resolving
 * them from node_modules at every start. The bundle's time is set to the start of the build,
 * so a source saved while it runs is still seen as newer.
 */
export async function buildCli() {
  const { build } = await import("esbuild");
  const started = new Date();
  const result = await build({
    absWorkingDir: ROOT,
    entryPoints: [CLI_ENTRY],
    bundle: true,
    platform: "node",
    format: "esm",
    target: "node20",
    // "@/…" resolves through tsconfig.json's paths.
    tsconfig: path.join(ROOT, "tsconfig.json"),
    // Bundled CommonJS packages may call require() for Node's own modules.
    banner: {
      js: 'import { createRequire as __cliCreateRequire } from "node:module"; const require = __cliCreateRequire(import.meta.url);',
    },
    write: false,
    metafile: true,
    logLevel: "error",
  });
  const bundle = path.join(ROOT, CLI_BUNDLE);
  mkdirSync(path.dirname(bundle), { recursive: true });
  writeAtomically(bundle, result.outputFiles[0].contents);
  utimesSync(bundle, started, started);
  const inputs = Object.keys(result.metafile.inputs).sort();
  writeAtomically(path.join(ROOT, CLI_INPUTS), `${JSON.stringify({ entry: CLI_ENTRY, inputs }, null, 1)}\n`);
  return { bundle, inputs };
}

if (process.argv[1] && import.meta.url === pathToFileURL(path.resolve(process.argv[1])).href) {
  const started = performance.now();
  buildCli().then(
    ({ bundle, inputs }) => {
      process.stdout.write(`${path.relative(ROOT, bundle)}: ${inputs.length} files in ${Math.round(performance.now() - started)} ms\n`);
    },
    () => {
      // esbuild has already printed what is wrong.
      process.exitCode = 1;
    },
  );
}
