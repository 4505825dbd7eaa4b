// The static-file baseline of the reader-page benchmarks: nginx from Debian (one worker process) serving the very
// bytes the app served, identity and gzip, so a run compares the app with a plain file server on the same machine.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { chmodSync, mkdirSync, writeFileSync } from 'node:fs';
import { get } from 'node:http';
import { join } from 'node:path';
import { freePort, sleep } from './app-process';

/** The raw bytes of a response, as sent (no decoding). */
export function fetchRaw(url: string, acceptEncoding: string) {
  return new Promise<{ status: number; headers: Record<string, unknown>; body: Buffer }>((done, fail) => {
    get(url, { headers: { 'accept-encoding': acceptEncoding } }, (res) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => done({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }));
    }).on('error', fail);
  });
}

function hasNginx(): boolean {
  return spawnSync('sh', ['-c', 'command -v nginx'], { stdio: 'ignore' }).status === 0;
}

/** nginx from Debian, installed with apt only when missing; false when that is not possible here. */
export function ensureNginx(log: (line: string) => void): boolean {
  if (hasNginx()) return true;
  if (typeof process.getuid !== 'function' || process.getuid() !== 0) {
    log('nginx is not installed and this user cannot install it: app figures only.');
    return false;
  }
  log('installing nginx-light from Debian for the baseline…');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  spawnSync('apt-get', ['update', '-qq'], { stdio: 'inherit', env });
  spawnSync('apt-get', ['install', '-y', '-qq', '--no-install-recommends', 'nginx-light'], { stdio: 'inherit', env });
  if (hasNginx()) return true;
  log('nginx could not be installed: app figures only.');
  return false;
}

export interface PageBytes {
  identity: Buffer;
  gzip: Buffer;
}

/**
 * Starts nginx in `workDir` serving each page at its path (gzip_static: the stored .gz for clients that accept gzip,
 * with the Cache-Control the app sends), waits until it answers and checks it sends the same gzip bytes for every
 * page. The caller stops the returned process.
 */
export async function startStaticBaseline(
  workDir: string,
  pages: Map<string, PageBytes>,
): Promise<{ url: string; child: ChildProcess }> {
  const root = join(workDir, 'root');
  const temp = join(workDir, 'temp');
  for (const dir of [root, temp]) mkdirSync(dir, { recursive: true });
  // nginx started by root reads files as its unprivileged worker user: the folder must be readable to it.
  chmodSync(workDir, 0o755);
  const locations = [...pages.entries()].map(([path, bytes], n) => {
    const file = join(root, `page-${n}.html`);
    writeFileSync(file, bytes.identity);
    writeFileSync(`${file}.gz`, bytes.gzip);
    return `    location = ${path} { alias ${file}; }`;
  });
  const port = await freePort();
  const conf = join(workDir, 'nginx.conf');
  writeFileSync(
    conf,
    `worker_processes 1;
daemon off;
pid ${join(workDir, 'nginx.pid')};
error_log stderr warn;
events { worker_connections 4096; }
http {
  access_log off;
  sendfile on;
  tcp_nopush on;
  keepalive_requests 1000000;
  client_body_temp_path ${temp}; proxy_temp_path ${temp}; fastcgi_temp_path ${temp}; uwsgi_temp_path ${temp}; scgi_temp_path ${temp};
  server {
    listen 127.0.0.1:${port};
    default_type "text/html; charset=utf-8";
    gzip_static on;
    gzip_vary on;
    add_header Cache-Control "public, max-age=60, must-revalidate";
${locations.join('\n')}
  }
}
`,
  );
  const child = spawn('nginx', ['-p', workDir, '-c', conf, '-e', 'stderr'], { stdio: ['ignore', 'ignore', 'inherit'] });
  const url = `http://127.0.0.1:${port}`;
  const [first] = pages.keys();
  for (let tries = 0; ; tries++) {
    if (child.exitCode !== null) throw new Error(`nginx exited with ${child.exitCode}`);
    const up = await fetchRaw(`${url}${first}`, 'gzip').catch(() => null);
    if (up?.status === 200) break;
    if (tries > 80) {
      child.kill('SIGTERM');
      throw new Error('nginx did not answer');
    }
    await sleep(250);
  }
  for (const [path, bytes] of pages) {
    const same = await fetchRaw(`${url}${path}`, 'gzip');
    if (same.headers['content-encoding'] !== 'gzip' || !same.body.equals(bytes.gzip)) {
      child.kill('SIGTERM');
      throw new Error(`nginx does not serve the same gzip bytes as the app for ${path}`);
    }
  }
  return { url, child };
}
