/**
 * One Seepwise app instance in its own process, for the tests that kill it: builds createApp on
 * DATABASE_URL, listens on 127.0.0.1 (PORT, 0 = any free port) and prints one JSON line with
 * the port once it accepts requests. Run with `tsx --tsconfig server/tsconfig.json`.
 */
import { serveApp } from './app-instance';

const url = process.env.DATABASE_URL;
if (!url) throw new Error('app-server: set DATABASE_URL');
const served = await serveApp(url, { port: Number(process.env.PORT ?? 0) });
process.stdout.write(`${JSON.stringify({ listening: served.url, pid: process.pid })}\n`);
const stop = () => void served.close().then(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
