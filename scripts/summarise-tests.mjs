// Adds up the vitest JSON reports and the one-line checks (typecheck, lint, build, server) of a test run,
// prints "N passed, N failed" alone on the last line, and exits non-zero on any failure or missing report.
import fs from "node:fs";
import path from "node:path";

const [dir, ...reports] = process.argv.slice(2);
let passed = 0;
let failed = 0;

for (const file of fs.readdirSync(dir).filter((f) => f.endsWith(".check"))) {
  const ok = fs.readFileSync(path.join(dir, file), "utf8").trim() === "pass";
  if (ok) passed++;
  else {
    failed++;
    console.error(`failed check: ${file.replace(/\.check$/, "")}`);
  }
}

for (const name of reports) {
  const file = path.join(dir, name);
  if (!fs.existsSync(file)) {
    failed++;
    console.error(`no report ${name}: that suite did not run`);
    continue;
  }
  const r = JSON.parse(fs.readFileSync(file, "utf8"));
  passed += r.numPassedTests;
  failed += r.numFailedTests;
  // A suite that failed to load counts as a failure even with no test in it.
  for (const suite of r.testResults ?? []) {
    if (suite.status === "failed" && (suite.assertionResults ?? []).every((a) => a.status !== "failed")) {
      failed++;
      console.error(`suite failed to run: ${path.relative(process.cwd(), suite.name)}: ${String(suite.message).slice(0, 300)}`);
    }
  }
  if (r.numTotalTests === 0) {
    failed++;
    console.error(`${name}: no tests ran`);
  }
}

console.log(`${passed} passed, ${failed} failed`);
process.exit(failed === 0 ? 0 : 1);
