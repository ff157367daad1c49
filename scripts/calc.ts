// Command line of the calculation core: `npm run --silent calc -- input.json` prints the
// analysis result (contract v1) as JSON on stdout. A file that cannot be read, is not JSON or
// is not a valid input prints every problem with its JSON path on stderr, nothing on stdout,
// and exits with 1; a wrong command line exits with 2.
import { readFileSync } from "node:fs";
import { analyseText } from "../modules/calc/index";

const USAGE = "usage: npm run --silent calc -- input.json";

function main(args: string[]): number {
  const [file, ...rest] = args;
  if (file === undefined || rest.length > 0 || file === "--help" || file === "-h") {
    process.stderr.write(`${USAGE}\n`);
    return 2;
  }
  let text: string;
  try {
    text = readFileSync(file, "utf8");
  } catch (e) {
    process.stderr.write(`${file}: cannot read the file (${(e as NodeJS.ErrnoException).code ?? (e as Error).message})\n`);
    return 1;
  }
  let outcome: ReturnType<typeof analyseText>;
  try {
    outcome = analyseText(text);
  } catch (e) {
    process.stderr.write(`${file}: ${(e as Error).message}\n`);
    return 1;
  }
  if (!outcome.ok) {
    process.stderr.write(`${file}: the input is not valid (${outcome.issues.length} problem${outcome.issues.length === 1 ? "" : "s"})\n`);
    for (const issue of outcome.issues) process.stderr.write(`  ${issue.path}: ${issue.message}\n`);
    return 1;
  }
  process.stdout.write(`${JSON.stringify(outcome.result)}\n`);
  return 0;
}

// A reader that stops early (`| head`) is not an error of ours.
process.stdout.on("error", (e: NodeJS.ErrnoException) => {
  if (e.code === "EPIPE") process.exit(process.exitCode ?? 0);
  throw e;
});

process.exitCode = main(process.argv.slice(2));
