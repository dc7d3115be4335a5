// `npm start`: build the client when dist/index.html is missing, then run the server with tsx.
// Plain Node (no shell), so it behaves the same on Linux, macOS and Windows.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const require = createRequire(path.join(root, 'package.json'));
const node = process.execPath;

if (!existsSync(path.join(root, 'dist', 'index.html'))) {
  console.log('dist/index.html is missing: building the client with Vite…');
  const vite = path.join(path.dirname(require.resolve('vite/package.json')), 'bin', 'vite.js');
  const build = spawnSync(node, [vite, 'build'], { cwd: root, stdio: 'inherit' });
  if (build.status !== 0) {
    console.error('The client build failed; see the messages above.');
    process.exit(build.status ?? 1);
  }
}

const tsx = path.join(path.dirname(require.resolve('tsx/package.json')), 'dist', 'cli.mjs');
const server = spawn(node, [tsx, 'server/index.ts'], { cwd: root, stdio: 'inherit' });
for (const signal of ['SIGINT', 'SIGTERM']) {
  process.on(signal, () => server.kill(signal));
}
server.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
