// Adds up the Vitest and Playwright JSON reports and prints CI's closing line:
// "N passed, N failed, N skipped". Exits 1 when any test failed or a report is missing.
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";

const dir = process.argv[2] ?? ".data/test-results";
const read = (name) => {
  const file = path.join(dir, name);
  return existsSync(file) ? JSON.parse(readFileSync(file, "utf8")) : null;
};

let passed = 0, failed = 0, skipped = 0, missing = [];
const vitest = read("vitest.json");
if (vitest) {
  passed += vitest.numPassedTests;
  failed += vitest.numFailedTests;
  skipped += vitest.numPendingTests + (vitest.numTodoTests ?? 0);
  if (!vitest.success && vitest.numFailedTests === 0) failed += 1; // a suite that failed to load
} else missing.push("vitest");
const pw = read("playwright.json");
if (pw) {
  passed += pw.stats.expected + pw.stats.flaky;
  failed += pw.stats.unexpected;
  skipped += pw.stats.skipped;
  if ((pw.errors ?? []).length) failed += pw.errors.length;
} else missing.push("playwright");

if (missing.length) console.log(`missing reports: ${missing.join(", ")}`);
console.log(`vitest: ${vitest ? `${vitest.numPassedTests} passed` : "no report"}; playwright: ${pw ? `${pw.stats.expected} passed` : "no report"}`);
console.log(`${passed} passed, ${failed} failed, ${skipped} skipped`);
process.exit(failed || missing.length ? 1 : 0);
