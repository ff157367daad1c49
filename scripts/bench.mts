// `npm run bench`: a table of median and spread per section on the demo foundation.
// `npm run --silent bench -- --json FILE`: {"fullAnalysisMs": {"median", "min", "max"}, "runs"}
// for the input in FILE. Optional: --runs N; --no-http skips the HTTP section (which starts
// the production build on loopback against the local database `npm start` set up); --quick
// shortens the HTTP runs for a smoke check; --no-browser skips the typing benchmark in headless
// chromium; --servers 2 starts two `next start` processes behind nginx and takes the HTTP
// figures through the balancer; --ports A,B and --balancer-port P choose the loopback ports
// (default 3400, 3401 and the next one).
import { benchCalc, DEFAULT_BENCH_INPUT, type BenchSection } from "./bench-calc.mts";
import { benchCalculateApi, benchLoadSuite, benchSequentialPages, benchWorstAcceptedHttp, formatHttpTable, startBenchServer, type BenchServer } from "./bench-http.mts";
import { benchWorkspaceTyping, formatBrowserTable } from "./bench-browser.mts";
import { analyse, parseAnalysisInput } from "../modules/calc/index.ts";
import { worstAcceptedInput } from "../tests/support/limit-inputs.ts";

const fmt = (v: number) => v.toFixed(0);
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)] ?? NaN;

/** The heaviest input the contract accepts (INPUT_LIMITS), analysed in this thread. */
function worstAcceptedLine(runs: number): string {
  const parsed = parseAnalysisInput(worstAcceptedInput());
  if (!parsed.ok) throw new Error(`the worst accepted input is refused: ${JSON.stringify(parsed.issues)}`);
  const ms: number[] = [];
  let bytes = 0;
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    bytes = JSON.stringify(analyse(parsed.input)).length;
    ms.push(performance.now() - t0);
  }
  return `worst accepted input (INPUT_LIMITS), in-thread: median ${fmt(median(ms))} ms, max ${fmt(Math.max(...ms))} ms per analysis (${runs} runs), result ${(bytes / 1e6).toFixed(1)} MB of JSON`;
}

interface Args {
  json?: string;
  runs: number;
  http: boolean;
  browser: boolean;
  quick: boolean;
  servers: number;
  ports?: number[];
  balancerPort?: number;
  /** --only a,b: just these HTTP sections (sequential, browser, worst, calculate, load). */
  only?: Set<string>;
}

const SECTIONS = ["sequential", "browser", "worst", "calculate", "load"];
const isPort = (v: string | undefined) => v !== undefined && /^\d{2,5}$/.test(v) && Number(v) < 65536;

function parseArgs(argv: string[]): Args | string {
  let json: string | undefined;
  let runs = 300;
  let http = true;
  let browser = true;
  let quick = false;
  let servers = 1;
  let ports: number[] | undefined;
  let balancerPort: number | undefined;
  let only: Set<string> | undefined;
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    const next = argv[i + 1];
    if (arg === "--json" && next !== undefined) {
      json = next;
      i++;
    } else if (arg === "--no-http") {
      http = false;
    } else if (arg === "--quick") {
      quick = true;
    } else if (arg === "--no-browser") {
      browser = false;
    } else if (arg === "--servers" && (next === "1" || next === "2")) {
      servers = Number(next);
      i++;
    } else if (arg === "--ports" && next !== undefined && next.split(",").every(isPort)) {
      ports = next.split(",").map(Number);
      i++;
    } else if (arg === "--only" && next !== undefined && next.split(",").every((x) => SECTIONS.includes(x))) {
      only = new Set(next.split(","));
      i++;
    } else if (arg === "--balancer-port" && isPort(next)) {
      balancerPort = Number(next);
      i++;
    } else if (arg === "--runs" && next !== undefined && Number.isInteger(Number(next)) && Number(next) > 0) {
      runs = Number(next);
      i++;
    } else {
      return `unknown or incomplete argument: ${arg ?? ""}`;
    }
  }
  if (ports && ports.length < servers) return `--ports names ${ports.length} port(s) for --servers ${servers}`;
  const base = ports ?? [3400, 3401];
  const chosen = { runs, http, browser, quick, servers, ports: base.slice(0, servers), ...(balancerPort === undefined ? {} : { balancerPort }), ...(only ? { only } : {}) };
  return json === undefined ? chosen : { json, ...chosen };
}

function formatTable(description: string, sections: BenchSection[]): string {
  const head = ["section", "median ms", "min ms", "p10 ms", "p90 ms", "max ms", "runs"];
  const rows = sections.map((s) => [
    s.name,
    ...[s.stats.median, s.stats.min, s.stats.p10, s.stats.p90, s.stats.max].map((v) => v.toFixed(3)),
    String(s.stats.runs),
  ]);
  const widths = head.map((h, c) => Math.max(h.length, ...rows.map((r) => (r[c] ?? "").length)));
  const line = (cells: string[]) => cells.map((cell, c) => (c === 0 ? cell.padEnd(widths[c] ?? 0) : cell.padStart(widths[c] ?? 0))).join("  ");
  return [description, line(head), ...rows.map(line)].join("\n");
}

async function browserSection(server: BenchServer, quick: boolean): Promise<void> {
  const keystrokes = quick ? 10 : 50;
  try {
    const { timings, soilBand } = await benchWorkspaceTyping(server, keystrokes);
    process.stdout.write(
      `\nTyping in the workspace (headless chromium, demo pump train, soil band ${soilBand ? "on" : "NOT shown"}): input event to the painted results on screen, as the page measures it; "settled": to the frame in which the plots and the panels out of view show them too\n${formatBrowserTable(timings)}\n`,
    );
  } catch (e) {
    process.stdout.write(`\nBrowser section failed: ${(e as Error).message}\n`);
  }
}

async function httpSection(args: Args): Promise<void> {
  const { quick } = args;
  const server = await startBenchServer({ ports: args.ports, ...(args.balancerPort === undefined ? {} : { balancerPort: args.balancerPort }) });
  if (typeof server === "string") {
    process.stdout.write(`\nHTTP section skipped: ${server}\n`);
    return;
  }
  const where = server.servers > 1 ? `${server.servers} next start processes behind nginx at ${server.baseUrl}` : `one next start process at ${server.baseUrl}`;
  try {
    const wants = (section: string) => !args.only || args.only.has(section);
    if (wants("sequential")) {
      const sequential = await benchSequentialPages(server, quick ? 2 : 10);
      process.stdout.write(`\nSequential server time (one client), ${where}\n${formatHttpTable(sequential)}\n`);
    }
    if (args.browser && wants("browser")) await browserSection(server, quick);
    if (wants("worst")) {
      const worst = await benchWorstAcceptedHttp(server, quick ? 1 : 3);
    process.stdout.write(
      `\nWorst accepted input on POST /api/v1/calculate (analysis pool): median ${fmt(median(worst.analysisMs))} ms per analysis (statuses ${worst.statuses.join(", ")}); ` +
          `GET /api/health meanwhile: ${worst.healthMs.length} requests, median ${median(worst.healthMs).toFixed(1)} ms, max ${Math.max(...worst.healthMs).toFixed(1)} ms\n`,
      );
    }
    if (wants("calculate")) {
      const rows = [await benchCalculateApi(server, DEFAULT_BENCH_INPUT, quick ? 3 : 10)];
      process.stdout.write(`\nHTTP on the production build, loopback, ${where}: the calculation API\n${formatHttpTable(rows)}\n`);
    }
    if (wants("load")) {
      const clients = 50;
      const seconds = quick ? 5 : 30;
      const load = await benchLoadSuite(server, DEFAULT_BENCH_INPUT, clients, seconds);
      process.stdout.write(`\nLoad: ${clients} concurrent clients, ${seconds} s per endpoint, ${where}\n${formatHttpTable(load)}\n`);
    }
  } finally {
    await server.stop();
  }
}

async function main(argv: string[]): Promise<number> {
  const args = parseArgs(argv);
  if (typeof args === "string") {
    process.stderr.write(`${args}\nusage: npm run bench [-- --json FILE] [--runs N] [--no-http] [--no-browser] [--quick] [--servers 1|2] [--ports A,B] [--balancer-port P] [--only sequential,browser,worst,calculate,load]\n`);
    return 2;
  }
  try {
    if (args.json !== undefined) {
      const full = benchCalc(args.json, args.runs).sections[0]?.stats;
      if (!full) throw new Error("no full-analysis timing");
      process.stdout.write(`${JSON.stringify({ fullAnalysisMs: { median: full.median, min: full.min, max: full.max }, runs: full.runs })}\n`);
    } else {
      // --only names HTTP sections: the engine-only table is left out then
      if (!args.only) {
        const { description, sections } = benchCalc(DEFAULT_BENCH_INPUT, args.runs);
        process.stdout.write(`${formatTable(description, sections)}\n`);
        process.stdout.write(`${worstAcceptedLine(args.quick ? 2 : 5)}\n`);
      }
      if (args.http) await httpSection(args);
    }
    return 0;
  } catch (e) {
    process.stderr.write(`bench: ${(e as Error).message}\n`);
    return 1;
  }
}

process.exitCode = await main(process.argv.slice(2));
