// `npm start`: build the client when the one in CLIENT_DIST (default ./dist) is missing or was
// built from other sources than the current ones (scripts/client-build.mjs), then run the
// server with tsx. Plain Node (no shell), so it behaves the same on Linux, macOS and Windows.
import { spawn } from 'node:child_process';
import { createRequire } from 'node:module';
import path from 'node:path';
import { ROOT, clientDist, ensureClientBuilt } from './client-build.mjs';

const require = createRequire(path.join(ROOT, 'package.json'));
const node = process.execPath;

try {
  ensureClientBuilt(ROOT, clientDist(ROOT), { inherit: true, log: (m) => console.log(m) });
} catch {
  console.error('The client build failed; see the messages above.');
  process.exit(1);
}

const tsx = path.join(path.dirname(require.resolve('tsx/package.json')), 'dist', 'cli.mjs');
const server = spawn(node, [tsx, 'server/index.ts'], { cwd: ROOT, stdio: 'inherit' });
for (const signal of ['SIGINT', 'SIGTERM']) {
  process.on(signal, () => server.kill(signal));
}
server.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
