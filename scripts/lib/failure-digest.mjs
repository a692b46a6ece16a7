// The names of the tests that failed, read from the runners' JSON reports, for the end of
// `npm test`: a long run's own output scrolls away, and CI may keep only its last lines.
import { existsSync, readFileSync } from 'node:fs';
import { stripVTControlCharacters } from 'node:util';

const firstLine = (text) => stripVTControlCharacters(String(text ?? '')).split('\n').find((l) => l.trim())?.trim().slice(0, 300) ?? '';

/** Vitest's JSON reporter: testResults[].assertionResults[] with status and failureMessages. */
export function vitestFailures(file) {
  if (!existsSync(file)) return [];
  const report = JSON.parse(readFileSync(file, 'utf8'));
  const failures = [];
  for (const result of report.testResults ?? []) {
    const name = result.name?.replace(process.cwd() + '/', '') ?? '?';
    const failed = (result.assertionResults ?? []).filter((a) => a.status === 'failed');
    for (const a of failed) failures.push(`${name} › ${a.fullName}: ${firstLine(a.failureMessages?.[0])}`);
    // A file that failed before any test ran (an import error, a hook) has no failed assertion.
    if (!failed.length && result.status === 'failed') failures.push(`${name}: ${firstLine(result.message)}`);
  }
  return failures;
}

/** Playwright's JSON reporter: suites nest; a spec's tests hold results with status and error. */
export function playwrightFailures(file) {
  if (!existsSync(file)) return [];
  const report = JSON.parse(readFileSync(file, 'utf8'));
  const failures = [];
  const walk = (suite, titles) => {
    for (const spec of suite.specs ?? []) {
      for (const t of spec.tests ?? []) {
        const last = t.results?.at(-1);
        if (last && !['passed', 'skipped'].includes(last.status)) failures.push(`${spec.file}:${spec.line} › ${[...titles, spec.title].join(' › ')}: ${firstLine(last.error?.message ?? last.status)}`);
      }
    }
    for (const child of suite.suites ?? []) walk(child, suite.title && !suite.title.endsWith('.ts') ? [...titles, suite.title] : titles);
  };
  for (const suite of report.suites ?? []) walk(suite, []);
  for (const error of report.errors ?? []) failures.push(`(outside a test): ${firstLine(error.message)}`);
  return failures;
}
