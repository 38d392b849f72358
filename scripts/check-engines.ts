// Checks that every package in package-lock.json runs on every Node version
// package.json promises: a package whose engines.node leaves out any of them
// is named, and the check fails. `npm ci` only warns (EBADENGINE), and only
// about the Node it runs on; this looks at the whole promised range.
//   npx tsx scripts/check-engines.ts [package.json] [package-lock.json]
//
// Packages npm would never install on the machines Keepstitch runs on (Debian
// on x64 or arm64, glibc) are left out: prebuilt binaries for other systems
// (os, cpu, libc in the lockfile) and whatever only they depend on.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import semver from 'semver';

interface LockPackage {
  version?: string;
  engines?: Record<string, string> | string[];
  os?: string[];
  cpu?: string[];
  libc?: string[];
  dependencies?: Record<string, string>;
  devDependencies?: Record<string, string>;
  optionalDependencies?: Record<string, string>;
  peerDependencies?: Record<string, string>;
}

export interface Lockfile {
  packages?: Record<string, LockPackage>;
}

export interface EngineProblem {
  name: string;
  version: string;
  wants: string;
}

/** The platforms the project is installed on: its scripts use Debian's packages. */
export const PLATFORMS = [
  { os: 'linux', cpu: 'x64', libc: 'glibc' },
  { os: 'linux', cpu: 'arm64', libc: 'glibc' },
] as const;

/** npm's rule for os/cpu/libc lists: names allow, "!name" forbids, no list allows all. */
function allows(list: string[] | undefined, value: string): boolean {
  if (!list || list.length === 0) return true;
  if (list.includes(`!${value}`)) return false;
  const positives = list.filter((v) => !v.startsWith('!'));
  return positives.length === 0 || positives.includes(value);
}

function installsHere(pkg: LockPackage): boolean {
  return PLATFORMS.some((p) => allows(pkg.os, p.os) && allows(pkg.cpu, p.cpu) && allows(pkg.libc, p.libc));
}

/** The name of the package installed at a lockfile path ("node_modules/a/node_modules/@b/c" is "@b/c"). */
function packageName(lockPath: string): string {
  return lockPath.slice(lockPath.lastIndexOf('node_modules/') + 'node_modules/'.length);
}

/** Where Node finds dependency `name` of the package at `from`: its own node_modules, then each parent's. */
function resolve(packages: Record<string, LockPackage>, from: string, name: string): string | undefined {
  let dir = from;
  for (;;) {
    const candidate = `${dir ? `${dir}/` : ''}node_modules/${name}`;
    if (packages[candidate]) return candidate;
    if (!dir) return undefined;
    const up = dir.lastIndexOf('/node_modules/');
    dir = up === -1 ? '' : dir.slice(0, up);
  }
}

/** The lockfile paths of the packages installed on PLATFORMS, walking dependencies from the root. */
export function installedPackages(lock: Lockfile): string[] {
  const packages = lock.packages ?? {};
  const seen = new Set<string>();
  const queue = [''];
  while (queue.length > 0) {
    const at = queue.pop()!;
    const pkg = packages[at];
    if (!pkg) continue;
    const names = new Set([
      ...Object.keys(pkg.dependencies ?? {}),
      ...Object.keys(pkg.optionalDependencies ?? {}),
      ...Object.keys(pkg.peerDependencies ?? {}),
      ...(at === '' ? Object.keys(pkg.devDependencies ?? {}) : []),
    ]);
    for (const name of names) {
      const found = resolve(packages, at, name);
      if (!found || seen.has(found) || !installsHere(packages[found]!)) continue;
      seen.add(found);
      queue.push(found);
    }
  }
  return [...seen];
}

/** Every installed package whose engines.node excludes some Node version in `promised`. */
export function engineProblems(promised: string, lock: Lockfile): EngineProblem[] {
  const range = semver.validRange(promised);
  if (!range) throw new Error(`package.json promises Node "${promised}", which is not a version range.`);
  const packages = lock.packages ?? {};
  const problems: EngineProblem[] = [];
  for (const at of installedPackages(lock)) {
    const pkg = packages[at]!;
    // The old array form of engines (["node >= 0.6"]) is ignored by npm too.
    const wants = pkg.engines && !Array.isArray(pkg.engines) ? pkg.engines['node'] : undefined;
    if (!wants) continue;
    // loose: some old packages write ranges such as ">= 0.8.x".
    if (!semver.subset(range, wants, { loose: true })) problems.push({ name: packageName(at), version: pkg.version ?? '?', wants });
  }
  return problems.sort((a, b) => a.name.localeCompare(b.name) || a.version.localeCompare(b.version));
}

function main(): void {
  const root = path.resolve(__dirname, '..');
  const packageFile = process.argv[2] ?? path.join(root, 'package.json');
  const lockFile = process.argv[3] ?? path.join(root, 'package-lock.json');
  const promised = (JSON.parse(readFileSync(packageFile, 'utf8')) as { engines?: { node?: string } }).engines?.node;
  if (!promised) {
    console.error(`${packageFile} has no engines.node: say there which Node versions the project runs on.`);
    process.exit(1);
  }
  const lock = JSON.parse(readFileSync(lockFile, 'utf8')) as Lockfile;
  const problems = engineProblems(promised, lock);
  if (problems.length === 0) {
    console.log(`All ${installedPackages(lock).length} locked packages accept every Node version package.json promises (${promised}).`);
    return;
  }
  console.error(`These packages do not accept every Node version package.json promises (${promised}):`);
  for (const p of problems) console.error(`  ${p.name}@${p.version} wants Node ${p.wants}`);
  console.error('Pin versions whose engines fit (npm view <package>@<version> engines), or narrow engines.node in package.json.');
  process.exit(1);
}

if (require.main === module) main();
