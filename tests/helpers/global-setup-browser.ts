/**
 * Browser tests need Debian's Chromium and a built client. Chromium is installed when missing
 * (as root; otherwise the exact command is printed); the client is built once per run.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';

export const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

export default function setup() {
  if (!fs.existsSync(CHROMIUM)) {
    if (process.getuid?.() !== 0) {
      throw new Error(`Chromium is missing. Install it with: sudo apt-get update && sudo apt-get install -y chromium`);
    }
    console.log('Installing Debian chromium for the browser tests (one time)...');
    execFileSync('apt-get', ['update', '-qq'], { stdio: 'inherit' });
    execFileSync('apt-get', ['install', '-y', '-qq', 'chromium'], { stdio: 'inherit', env: { ...process.env, DEBIAN_FRONTEND: 'noninteractive' } });
  }
  execFileSync('npx', ['vite', 'build', '--logLevel', 'warn'], { stdio: 'inherit' });
}
