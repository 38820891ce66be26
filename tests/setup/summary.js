// The last lines of npm test: why anything was skipped (one line per reason), then one plain closing line
// that any reader of the log understands.
const results = require(process.argv[2]);
const reasons = new Set();
for (const file of results.testResults) {
  for (const t of file.assertionResults) {
    if (t.status !== 'pending') continue;
    const why = [...t.ancestorTitles, t.title].map((s) => /\(skipped: (.*)\)/.exec(s)).find(Boolean);
    reasons.add(why ? why[1] : `${t.fullName} (no reason given)`);
  }
}
for (const why of reasons) console.log(`skipped: ${why}`);
console.log(
  `tests: ${results.numPassedTests} passed, ${results.numFailedTests} failed, ${results.numPendingTests} skipped`,
);
