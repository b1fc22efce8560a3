// The closing line CI reads (`N passed, N failed`) is computed from vitest's JSON report.
import { describe, expect, it } from 'vitest';
import { summarise } from '../../scripts/test-summary.mjs';

describe('test summary', () => {
  it('counts passed and failed tests', () => {
    const r = summarise({
      numPassedTests: 7,
      numFailedTests: 2,
      testResults: [{ name: 'a', status: 'failed', assertionResults: [{ status: 'failed' }, { status: 'passed' }] }],
    });
    expect(r).toMatchObject({ passed: 7, failed: 2 });
  });

  it('counts a file that failed to load as a failure', () => {
    const r = summarise({
      numPassedTests: 3,
      numFailedTests: 0,
      testResults: [{ name: 'broken.test.ts', status: 'failed', message: 'Cannot find module', assertionResults: [] }],
    });
    expect(r.failed).toBe(1);
    expect(r.brokenFiles.map((f) => f.name)).toEqual(['broken.test.ts']);
  });

  it('never reports success when vitest itself exited non-zero', () => {
    expect(summarise({ numPassedTests: 5, numFailedTests: 0, testResults: [] }, 1)).toMatchObject({ passed: 5, failed: 1, unexplainedExit: true });
    expect(summarise({ numPassedTests: 5, numFailedTests: 0, testResults: [] }, 0)).toMatchObject({ passed: 5, failed: 0 });
  });
});
