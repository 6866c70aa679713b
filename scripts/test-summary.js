// @ts-check
// Prints the closing line "N passed, N failed" from jest's JSON report plus the script's own checks
// (type-check, lint), and exits non-zero when anything failed.
const fs = require('node:fs');

const [file, checksPassed = '0', checksFailed = '0', jestRc = '0'] = process.argv.slice(2);
let passed = Number(checksPassed);
let failed = Number(checksFailed);
let suitesFailed = 0;
try {
  const report = JSON.parse(fs.readFileSync(file, 'utf8'));
  passed += report.numPassedTests;
  failed += report.numFailedTests;
  suitesFailed = report.numFailedTestSuites - (report.testResults || []).filter(
    (/** @type {{assertionResults: {status: string}[]}} */ r) => r.assertionResults.some((a) => a.status === 'failed'),
  ).length;
  for (const suite of report.testResults || []) {
    if (suite.status === 'failed' && suite.assertionResults.every((/** @type {{status:string}} */ a) => a.status !== 'failed')) {
      console.log(`suite failed to run: ${suite.name}\n${(suite.message || '').slice(0, 2000)}`);
    }
  }
} catch (e) {
  console.log(`no jest report (${/** @type {Error} */ (e).message})`);
  failed += 1;
}
failed += Math.max(0, suitesFailed);
if (Number(jestRc) !== 0 && failed === 0) failed += 1;
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 ? 1 : 0);
