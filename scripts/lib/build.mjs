// Builds the client (Vite) and the server (Vite's SSR build, plain JavaScript for `node`) and skips either
// build when its inputs have not changed since it last succeeded: a hash of every input file's path and
// content is kept in dist/build-inputs.json. Content, not modification times, so a checkout or a copy that
// touches files without changing them does not rebuild, and an edit always does.
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, readdirSync, statSync, writeFileSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { projectRoot, runStep } from './setup.mjs';

const common = ['shared', 'package.json', 'package-lock.json', 'tsconfig.json'];
const targets = {
  client: {
    inputs: [...common, 'src', 'index.html', 'public', 'vite.config.ts'],
    output: 'dist/client/index.html',
    args: ['build', '--logLevel', 'warn'],
  },
  server: {
    inputs: [...common, 'server', 'vite.server.config.ts'],
    output: 'dist/server/index.js',
    args: ['build', '--config', 'vite.server.config.ts', '--logLevel', 'warn'],
  },
};
const stampFile = resolve(projectRoot, 'dist', 'build-inputs.json');

function listFiles(path, files) {
  if (!existsSync(path)) return;
  if (statSync(path).isDirectory()) {
    for (const entry of readdirSync(path).sort()) listFiles(join(path, entry), files);
  } else {
    files.push(path);
  }
}

function inputsHash(inputs) {
  const hash = createHash('sha256');
  for (const input of inputs) {
    const files = [];
    listFiles(resolve(projectRoot, input), files);
    for (const file of files) {
      hash.update(`${relative(projectRoot, file)}\0`);
      hash.update(readFileSync(file));
      hash.update('\0');
    }
  }
  return hash.digest('hex');
}

function readStamps() {
  try {
    return JSON.parse(readFileSync(stampFile, 'utf8'));
  } catch {
    return {};
  }
}

/** Builds what is out of date among `names` ('client', 'server'); says what it skipped. */
export function ensureBuilt(names = ['client', 'server'], env = process.env) {
  const stamps = readStamps();
  for (const name of names) {
    const target = targets[name];
    const hash = inputsHash(target.inputs);
    if (stamps[name] === hash && existsSync(resolve(projectRoot, target.output))) {
      console.log(`[build] ${name} is up to date`);
      continue;
    }
    console.log(`[build] building the ${name}…`);
    runStep('vite', target.args, env);
    // The first-load size, printed with every client build (scripts/report-bundle.mjs).
    if (name === 'client') {
      spawnSync(process.execPath, ['scripts/report-bundle.mjs'], { cwd: projectRoot, stdio: 'inherit', env });
    }
    stamps[name] = hash;
    mkdirSync(resolve(projectRoot, 'dist'), { recursive: true });
    writeFileSync(stampFile, `${JSON.stringify(stamps, null, 2)}\n`);
  }
}
