// Reads test counts from Jest's or Vitest's JSON report (both use the Jest result shape).
import fs from 'node:fs';

export function countResults(file) {
  try {
    const r = JSON.parse(fs.readFileSync(file, 'utf8'));
    return {
      passed: r.numPassedTests ?? 0,
      failed: (r.numFailedTests ?? 0) + (r.numRuntimeErrorTestSuites ?? 0),
    };
  } catch {
    return {};
  }
}
