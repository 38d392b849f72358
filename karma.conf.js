// Karma configuration for the Angular component specs (run by `ng test`).
const fs = require('node:fs');
const path = require('node:path');

process.env.CHROME_BIN ||= '/usr/bin/chromium';

/**
 * A small reporter that writes the totals of the run to test-output/karma.json,
 * so the project's test script can add them to its summary line.
 */
function SummaryFileReporter(baseReporterDecorator) {
  baseReporterDecorator(this);
  // Next to this file: the Angular builder points karma's basePath at a temporary build folder.
  const outFile = path.join(__dirname, 'test-output', 'karma.json');
  // No stale totals from an earlier run if this one never completes.
  fs.rmSync(outFile, { force: true });
  this.onRunComplete = (_browsers, results) => {
    const failed = results.failed + (results.error ? 1 : 0) + (results.disconnected ? 1 : 0);
    fs.mkdirSync(path.dirname(outFile), { recursive: true });
    fs.writeFileSync(outFile, JSON.stringify({ passed: results.success, failed }, null, 2) + '\n');
  };
  // The console output comes from the progress reporter; this one stays quiet.
  this.adapters = [];
}
SummaryFileReporter.$inject = ['baseReporterDecorator'];

module.exports = function (config) {
  config.set({
    frameworks: ['jasmine'],
    plugins: [
      require('karma-jasmine'),
      require('karma-chrome-launcher'),
      { 'reporter:summary-file': ['type', SummaryFileReporter] },
    ],
    client: {
      jasmine: { random: true },
      clearContext: false,
    },
    reporters: ['progress', 'summary-file'],
    customLaunchers: {
      ChromeHeadlessLocal: {
        base: 'ChromeHeadless',
        flags: [
          '--no-sandbox',
          '--headless',
          '--disable-gpu',
          '--disable-dev-shm-usage',
          '--disable-background-networking',
          '--disable-component-update',
          '--disable-sync',
          '--no-first-run',
        ],
      },
    },
    browsers: ['ChromeHeadlessLocal'],
    browserNoActivityTimeout: 60000,
    captureTimeout: 120000,
    singleRun: true,
    autoWatch: false,
    restartOnFileChange: false,
  });
};
