import { execFileSync } from 'node:child_process';
import { existsSync } from 'node:fs';

/**
 * Installs a Debian package when the file it provides is missing: as root through apt-get,
 * otherwise with a clear message naming the package. Returns whether the file exists afterwards.
 */
export function ensureDebianPackage(file: string, pkg: string, why: string): boolean {
  if (existsSync(file)) return true;
  if (process.getuid?.() !== 0) {
    console.error(
      `[setup] ${file} is missing: install Debian's '${pkg}' package as root ` +
        `(sudo apt-get install -y ${pkg}); it is needed for ${why}.`,
    );
    return false;
  }
  console.log(`[setup] installing Debian's ${pkg} (needed for ${why})`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  execFileSync('apt-get', ['install', '-y', '-qq', pkg], { stdio: 'inherit', env });
  return existsSync(file);
}
