export interface VitestJsonReport {
  numPassedTests?: number;
  numFailedTests?: number;
  testResults?: Array<{ name: string; status: string; message?: string; assertionResults?: Array<{ status: string }> }>;
}
export function summarise(
  report: VitestJsonReport,
  vitestExitCode?: number,
): { passed: number; failed: number; brokenFiles: NonNullable<VitestJsonReport['testResults']>; unexplainedExit: boolean };
