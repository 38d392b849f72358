/**
 * npm run bench:app — the production build's initial JavaScript (gzip transfer
 * size) and lazy chunks against a routed floor: an empty Angular Material app
 * of the same versions with the router and HttpClient, built in the same run
 * (target: initial JS at most 1.25x that floor; an empty Material app without
 * them is printed for comparison), and the raw figure that leaves for the
 * production build's budget in angular.json,
 * then first contentful paint of the sign-in page and the time until the
 * commissions list is shown, in headless Chromium on loopback (median of 5).
 * Figures, not a test. Needs PostgreSQL: run through `npm run bench:app`.
 */
import { execFileSync, spawn } from 'node:child_process';
import { gzipSync } from 'node:zlib';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, symlinkSync, unlinkSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium } from 'playwright-core';
import { Client } from 'pg';
import { DEMO_ACCOUNTS } from '../seeds/demo/accounts';

const ROOT = path.resolve(__dirname, '..');
const PORT = Number(process.env['BENCH_APP_PORT'] ?? 4394);
const BASE = `http://127.0.0.1:${PORT}`;
/** Initial JS at most this many times the routed floor's. */
const TARGET_RATIO = 1.25;
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
const kb = (n: number) => `${(n / 1024).toFixed(1)} kB`;

/** The production configuration's error budget for the initial bundle, as written in angular.json. */
function initialBudget(): string | undefined {
  const config = JSON.parse(readFileSync(path.join(ROOT, 'angular.json'), 'utf8'));
  const budgets = config.projects.keepstitch.architect.build.configurations.production.budgets as { type: string; maximumError?: string }[];
  return budgets.find((b) => b.type === 'initial')?.maximumError;
}
const parseKb = (figure: string) => Number.parseFloat(figure) * (/mb$/i.test(figure) ? 1024 : 1);

/** The files a module imports statically (not `import()`), from esbuild's minified output. */
function staticImports(code: string): string[] {
  return [...code.matchAll(/(?:import|export)(?:[^("'`;]*?from)?\s*["']\.\/([^"']+\.js)["']/g)].map((m) => m[1]!);
}

/**
 * Initial JS: the scripts index.html names and every file they import
 * statically, however many the builder lists as module preloads (it lists at
 * most 10), gzip-compressed; the other chunks are lazy.
 */
function sizes(browserDir: string) {
  const html = readFileSync(path.join(browserDir, 'index.html'), 'utf8');
  const initial = new Set<string>();
  const queue = [...html.matchAll(/(?:src|href)="([^"]+\.js)"/g)].map((m) => m[1]!);
  while (queue.length) {
    const file = queue.pop()!;
    if (initial.has(file)) continue;
    initial.add(file);
    queue.push(...staticImports(readFileSync(path.join(browserDir, file), 'utf8')));
  }
  const files = readdirSync(browserDir).filter((f) => f.endsWith('.js'));
  const gz = (f: string) => gzipSync(readFileSync(path.join(browserDir, f)), { level: 9 }).length;
  const initialBytes = [...initial].reduce((s, f) => s + gz(f), 0);
  const initialRawBytes = [...initial].reduce((s, f) => s + statSync(path.join(browserDir, f)).size, 0);
  const lazy = files.filter((f) => !initial.has(f));
  return {
    initialBytes,
    initialRawBytes,
    initialFiles: initial.size,
    lazyCount: lazy.length,
    lazyBytes: lazy.reduce((s, f) => s + gz(f), 0),
    initialByPackage: byPackage(path.join(browserDir, '..', 'stats.json'), initial),
  };
}

/**
 * Minified bytes in the initial files by where they come from (a package, or
 * the app's own code), from the metafile `--stats-json` writes. Gzip cannot be
 * shared out among sources, so these are before compression.
 */
function byPackage(statsFile: string, initial: Set<string>): Map<string, number> {
  const stats = JSON.parse(readFileSync(statsFile, 'utf8')) as { outputs: Record<string, { inputs: Record<string, { bytesInOutput: number }> }> };
  const found = new Map<string, number>();
  for (const [output, { inputs }] of Object.entries(stats.outputs)) {
    if (!initial.has(output.replace(/^browser\//, ''))) continue;
    for (const [input, { bytesInOutput }] of Object.entries(inputs)) {
      const parts = input.split('node_modules/');
      const inPackage = parts.length > 1 ? parts[parts.length - 1]!.split('/') : null;
      const from = inPackage ? inPackage.slice(0, inPackage[0]!.startsWith('@') ? 2 : 1).join('/') : "the app's own code";
      found.set(from, (found.get(from) ?? 0) + bytesInOutput);
    }
  }
  return found;
}

const FLOORS = {
  /** For comparison: an empty Material app, one button. */
  empty: `import { Component } from '@angular/core';
import { bootstrapApplication } from '@angular/platform-browser';
import { MatButtonModule } from '@angular/material/button';
@Component({ selector: 'app-root', imports: [MatButtonModule], template: '<button mat-flat-button>Hello</button>' })
class App {}
bootstrapApplication(App).catch((e) => console.error(e));
`,
  /** The floor the target is set against: the same with the router (one page) and HttpClient (one request at start), which any routed app that talks to an API carries. */
  routed: `import { Component, inject } from '@angular/core';
import { bootstrapApplication } from '@angular/platform-browser';
import { HttpClient, provideHttpClient } from '@angular/common/http';
import { RouterLink, RouterOutlet, provideRouter } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
@Component({ template: 'Page' })
class Page {}
@Component({ selector: 'app-root', imports: [MatButtonModule, RouterLink, RouterOutlet], template: '<a mat-flat-button routerLink="/">Hello</a><router-outlet />' })
class App {
  constructor() {
    inject(HttpClient).get('/api/ping').subscribe({ error: () => undefined });
  }
}
bootstrapApplication(App, { providers: [provideRouter([{ path: '', component: Page }]), provideHttpClient()] }).catch((e) => console.error(e));
`,
};

/** A floor app of the same versions, built with the project's own packages. */
function buildFloor(kind: keyof typeof FLOORS): string {
  const dir = mkdtempSync(path.join(os.tmpdir(), 'keepstitch-floor-'));
  // A link to the project's packages, used read-only by the build (never install through it).
  symlinkSync(path.join(ROOT, 'node_modules'), path.join(dir, 'node_modules'), 'dir');
  mkdirSync(path.join(dir, 'src'));
  writeFileSync(path.join(dir, 'src', 'main.ts'), FLOORS[kind]);
  writeFileSync(path.join(dir, 'src', 'index.html'), '<!doctype html><html><head><base href="/"></head><body><app-root></app-root></body></html>');
  writeFileSync(path.join(dir, 'src', 'styles.scss'), `@use '@angular/material' as mat;\nhtml { color-scheme: light dark; @include mat.theme((color: mat.$azure-palette, typography: Roboto, density: 0)); }\n`);
  writeFileSync(path.join(dir, 'tsconfig.json'), JSON.stringify({ compilerOptions: { strict: true, target: 'ES2022', module: 'preserve', moduleResolution: 'bundler', skipLibCheck: true, experimentalDecorators: true }, files: ['src/main.ts'] }));
  writeFileSync(path.join(dir, 'angular.json'), JSON.stringify({
    version: 1,
    cli: { analytics: false },
    projects: { floor: { projectType: 'application', root: '', sourceRoot: 'src', architect: { build: { builder: '@angular/build:application', options: { outputPath: 'dist/floor', browser: 'src/main.ts', index: 'src/index.html', tsConfig: 'tsconfig.json', styles: ['src/styles.scss'], optimization: { scripts: true, styles: { minify: true, inlineCritical: false }, fonts: false } } } } } },
  }));
  execFileSync(path.join(ROOT, 'node_modules', '.bin', 'ng'), ['build', '--progress=false', '--stats-json'], { cwd: dir, stdio: 'pipe', env: { ...process.env, NG_CLI_ANALYTICS: 'false' } });
  return dir;
}

async function main(): Promise<void> {
  // Always a fresh production build: sizes of an older one would say nothing about this tree.
  execFileSync(path.join(ROOT, 'node_modules', '.bin', 'ng'), ['build', '--configuration', 'production', '--progress=false', '--stats-json'], { cwd: ROOT, stdio: 'inherit' });
  const app = sizes(path.join(ROOT, 'dist', 'keepstitch', 'browser'));
  const floorSizes = (kind: keyof typeof FLOORS) => {
    const dir = buildFloor(kind);
    const found = sizes(path.join(dir, 'dist', 'floor', 'browser'));
    // Drop the link first, so removing the folder can never reach the project's packages.
    unlinkSync(path.join(dir, 'node_modules'));
    rmSync(dir, { recursive: true, force: true });
    return found;
  };
  const floor = floorSizes('empty');
  const routed = floorSizes('routed');

  const url = new URL(process.env['DATABASE_URL']!);
  url.pathname = '/keepstitch_bench_app';
  const admin = new URL(url.toString());
  admin.pathname = '/postgres';
  const a = new Client({ connectionString: admin.toString() });
  await a.connect();
  await a.query('DROP DATABASE IF EXISTS keepstitch_bench_app WITH (FORCE)');
  await a.end();
  const env = { ...process.env, DATABASE_URL: url.toString(), PORT: String(PORT), NODE_ENV: 'production', SESSION_SECRET: 'bench-app-'.padEnd(48, 'a'), UPLOAD_DIR: path.join(ROOT, '.data', 'bench-app-uploads'), PAYMENTS_API_URL: 'http://127.0.0.1:9', SMTP_PORT: '9' };
  execFileSync(process.execPath, ['--import', 'tsx', 'scripts/db.ts', 'prepare'], { cwd: ROOT, env, stdio: 'pipe' });
  const server = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], { cwd: ROOT, env, stdio: 'ignore' });
  const fcp: number[] = [];
  const formShown: number[] = [];
  const listShown: number[] = [];
  try {
    for (let i = 0; i < 80 && !(await fetch(`${BASE}/api/health`).then((r) => r.ok, () => false)); i++) await new Promise((r) => setTimeout(r, 250));
    const browser = await chromium.launch({ executablePath: process.env['CHROME_BIN'] ?? '/usr/bin/chromium', args: ['--no-sandbox', '--disable-gpu', '--disable-dev-shm-usage', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--no-first-run'] });
    for (let run = 0; run < 5; run++) {
      const context = await browser.newContext({ baseURL: BASE });
      const page = await context.newPage();
      await page.goto('/sign-in');
      await page.getByLabel('E-mail').waitFor();
      formShown.push(await page.evaluate(() => performance.now()));
      // The paint entry is recorded a frame after the paint itself: wait for it rather than read too early.
      fcp.push(
        await page.evaluate(
          () =>
            new Promise<number>((resolve) => {
              new PerformanceObserver((list) => {
                const entry = list.getEntriesByName('first-contentful-paint')[0];
                if (entry) resolve(entry.startTime);
              }).observe({ type: 'paint', buffered: true });
              setTimeout(() => resolve(NaN), 5000);
            }),
        ),
      );
      await page.getByLabel('E-mail').fill(DEMO_ACCOUNTS.owner.email);
      await page.getByLabel('Password').fill(DEMO_ACCOUNTS.owner.password);
      // Signed in, open the list afresh and time it from navigation to the first row shown.
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.waitForURL(/\/commissions/);
      await page.goto('/commissions');
      await page.locator('table tr[mat-row], [data-testid="commission-row"]').first().waitFor();
      listShown.push(await page.evaluate(() => performance.now()));
      await context.close();
    }
    await browser.close();
  } finally {
    server.kill('SIGTERM');
  }
  const ratio = app.initialBytes / routed.initialBytes;
  const budget = initialBudget();
  const allowedRaw = TARGET_RATIO * routed.initialRawBytes;
  console.log(`\n${new Date().toISOString()}, ${os.cpus().length} cores, Node ${process.version}`);
  console.log(`initial JS (gzip): app ${kb(app.initialBytes)} in ${app.initialFiles} files; routed floor (empty Material app with the router and HttpClient) ${kb(routed.initialBytes)}; ratio ${ratio.toFixed(2)} ${ratio <= TARGET_RATIO ? `PASS (at most ${TARGET_RATIO}x)` : `OVER ${TARGET_RATIO}x`}`);
  console.log(`  for comparison: the empty Material app ${kb(floor.initialBytes)}; ratio ${(app.initialBytes / floor.initialBytes).toFixed(2)}`);
  console.log(`  raw (before gzip): app ${kb(app.initialRawBytes)}; routed floor ${kb(routed.initialRawBytes)}; ${TARGET_RATIO}x that leaves ${kb(allowedRaw)}; angular.json's initial budget (which counts the global styles too) fails the build past ${budget ?? 'nothing (no budget set)'} ${budget && parseKb(budget) * 1024 <= allowedRaw ? '(within what the target leaves)' : '(MORE than the target leaves: lower it)'}`);
  console.log('  initial JS by where it comes from (minified, before gzip): app / with router and HttpClient / empty');
  const sources = [...app.initialByPackage.entries()].sort((x, y) => y[1] - x[1]).map(([from]) => from);
  for (const from of [...sources, ...[...routed.initialByPackage.keys(), ...floor.initialByPackage.keys()].filter((f) => !app.initialByPackage.has(f))].filter((f, i, all) => all.indexOf(f) === i)) {
    const cell = (m: Map<string, number>) => kb(m.get(from) ?? 0).padStart(9);
    console.log(`    ${from.padEnd(28)} ${cell(app.initialByPackage)} ${cell(routed.initialByPackage)} ${cell(floor.initialByPackage)}`);
  }
  console.log(`lazy chunks: ${app.lazyCount}, ${kb(app.lazyBytes)} gzip in all`);
  console.log(`first contentful paint of the sign-in page: median ${median(fcp).toFixed(0)} ms (${fcp.map((x) => x.toFixed(0)).join(', ')})`);
  console.log(`sign-in form shown, from navigation: median ${median(formShown).toFixed(0)} ms (${formShown.map((x) => x.toFixed(0)).join(', ')})`);
  console.log(`commissions list shown, from navigation: median ${median(listShown).toFixed(0)} ms (${listShown.map((x) => x.toFixed(0)).join(', ')})`);
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
