// The command line `npm run --silent calc -- input.json` (scripts/calc.ts), spawned with tsx.
import { spawnSync } from "node:child_process";
import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";

const root = path.resolve(import.meta.dirname, "../../..");
const tsx = path.join(root, "node_modules/.bin/tsx");
const examples = readdirSync(path.join(root, "examples")).filter((f) => f.endsWith(".json"));
const tmp = mkdtempSync(path.join(os.tmpdir(), "plinthwise-cli-"));

// spawning tsx takes about a second; allow for a loaded machine
const CLI_TIMEOUT_MS = 60_000;

function calc(...args: string[]) {
  return spawnSync(tsx, ["scripts/calc.ts", ...args], { cwd: root, encoding: "utf8", maxBuffer: 64 * 1024 * 1024 });
}

function writeInput(name: string, content: string): string {
  const file = path.join(tmp, name);
  writeFileSync(file, content);
  return file;
}

describe("calc command line", () => {
  it.each(examples)("prints the result of examples/%s on stdout and exits 0", (file) => {
    const out = calc(path.join("examples", file));
    expect(out.status).toBe(0);
    expect(out.stderr).toBe("");
    const result = JSON.parse(out.stdout);
    expect(result.schemaVersion).toBe(1);
    expect(result.engineVersion).toBe("1.9.0");
    // twelve modes for springs on a base block (two blocks, engine 1.8.0), six otherwise
    const doc = JSON.parse(readFileSync(path.join(root, "examples", file), "utf8"));
    expect(result.modes).toHaveLength(doc.impedance.base ? 12 : 6);
  }, CLI_TIMEOUT_MS);

  it("invalid input: every problem with its JSON path on stderr, nothing on stdout, exit 1", () => {
    const doc = JSON.parse(readFileSync(path.join(root, "examples/raw-water-pump-train.json"), "utf8"));
    doc.soil.poissonRatio = 0.62;
    doc.machines[1].rotors[0].bearings = [];
    const out = calc(writeInput("bad.json", JSON.stringify(doc)));
    expect(out.status).toBe(1);
    expect(out.stdout).toBe("");
    expect(out.stderr).toContain("soil.poissonRatio");
    expect(out.stderr).toContain("machines[1].rotors[0].bearings");
  }, CLI_TIMEOUT_MS);

  it("a file that is not JSON exits 1 with nothing on stdout", () => {
    const out = calc(writeInput("not.json", "{ schemaVersion: 1,"));
    expect(out.status).toBe(1);
    expect(out.stdout).toBe("");
    expect(out.stderr).toMatch(/not valid JSON/);
  }, CLI_TIMEOUT_MS);

  it("an unreadable file exits 1; a wrong command line exits 2", () => {
    const missing = calc(path.join(tmp, "missing.json"));
    expect(missing.status).toBe(1);
    expect(missing.stdout).toBe("");
    expect(missing.stderr).toMatch(/cannot read/);
    const usage = calc();
    expect(usage.status).toBe(2);
    expect(usage.stdout).toBe("");
    expect(usage.stderr).toMatch(/usage/);
  }, CLI_TIMEOUT_MS);
});
