// Reads vitest's JSON report into the numbers for the closing line `N passed, N failed`.

/**
 * passed/failed from a vitest (jest-compatible) JSON report. A test file that fails to load has no
 * failed assertion but still counts as one failure; so does a non-zero vitest exit with no failure.
 */
export function summarise(report, vitestExitCode = 0) {
  const brokenFiles = (report.testResults ?? []).filter((f) => f.status === 'failed' && !(f.assertionResults ?? []).some((a) => a.status === 'failed'));
  let failed = (report.numFailedTests ?? 0) + brokenFiles.length;
  const unexplainedExit = failed === 0 && vitestExitCode !== 0;
  if (unexplainedExit) failed = 1;
  return { passed: report.numPassedTests ?? 0, failed, brokenFiles, unexplainedExit };
}
