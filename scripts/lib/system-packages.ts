/** Installs Debian packages the project needs (MariaDB, Chromium, python3-iapws) only when missing. */
import { execFileSync, spawnSync } from 'node:child_process';

export interface SystemPackage {
  /** Debian package name */
  name: string;
  /** true when already usable, e.g. a binary exists */
  present: () => boolean;
}

const fileExists = (p: string) => spawnSync('test', ['-x', p]).status === 0;
const dpkgInstalled = (name: string) =>
  spawnSync('dpkg-query', ['-W', '-f=${Status}', name], { encoding: 'utf8' }).stdout?.includes('install ok installed') ?? false;

export const MARIADB: SystemPackage = { name: 'mariadb-server', present: () => fileExists('/usr/sbin/mariadbd') || fileExists('/usr/bin/mariadbd') };
export const CHROMIUM: SystemPackage = { name: 'chromium', present: () => fileExists('/usr/bin/chromium') };
export const PYTHON_IAPWS: SystemPackage = { name: 'python3-iapws', present: () => dpkgInstalled('python3-iapws') };

export function ensureSystemPackages(packages: SystemPackage[], log: (line: string) => void = console.log): void {
  const missing = packages.filter((p) => !p.present()).map((p) => p.name);
  if (missing.length === 0) return;
  const command = `apt-get update && DEBIAN_FRONTEND=noninteractive apt-get install -y --no-install-recommends ${missing.join(' ')}`;
  if (typeof process.getuid === 'function' && process.getuid() !== 0) {
    throw new Error(`Missing Debian packages: ${missing.join(', ')}. Install them as root with:\n  sudo sh -c '${command}'`);
  }
  log(`Installing Debian packages: ${missing.join(', ')} (once; later runs skip this)`);
  const lockWait = ['-o', 'DPkg::Lock::Timeout=600'];
  execFileSync('apt-get', [...lockWait, 'update', '-qq'], { stdio: ['ignore', 'ignore', 'inherit'] });
  execFileSync('apt-get', [...lockWait, 'install', '-y', '-qq', '--no-install-recommends', ...missing], {
    stdio: ['ignore', 'ignore', 'inherit'],
    env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' },
  });
}
