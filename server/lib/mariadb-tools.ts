import { spawn } from 'node:child_process';
import { createReadStream, createWriteStream, existsSync } from 'node:fs';
import { pipeline } from 'node:stream/promises';
import { join } from 'node:path';
import { connectionOptions } from '../data-source';

// The same places scripts/lib/mariadb.mjs looks for Debian's MariaDB programs.
const searchDirs = ['/usr/bin', '/usr/sbin', '/usr/local/bin', '/usr/local/sbin'];

/** The path of the first of `names` found, or an error that says which Debian package brings it. */
export function findMariadbTool(names: string[]): string {
  for (const dir of searchDirs) {
    for (const name of names) {
      const candidate = join(dir, name);
      if (existsSync(candidate)) return candidate;
    }
  }
  throw new Error(`${names[0]} was not found: install Debian's mariadb-client ("apt-get install mariadb-client").`);
}

/**
 * Command-line options and environment that connect a MariaDB client program to the database of a DATABASE_URL.
 * `--no-defaults` comes first so no /etc/mysql or ~/.my.cnf setting leaks in; the password travels in MYSQL_PWD,
 * never on the command line where other users could read it in the process list.
 */
export function clientConnection(databaseUrl: string) {
  const { host, port, username, password, database } = connectionOptions(databaseUrl);
  return {
    database,
    args: ['--no-defaults', `--host=${host}`, `--port=${port}`, `--user=${username}`, '--protocol=TCP'],
    env: { ...process.env, MYSQL_PWD: password },
  };
}

/**
 * Runs a program to its end, its standard input read from `inputFile` and its standard output written to
 * `outputFile` when given (otherwise returned). Rejects with the program's own error text when it fails.
 */
export async function runTool(
  command: string,
  args: string[],
  options: { env?: NodeJS.ProcessEnv; inputFile?: string; outputFile?: string } = {},
): Promise<string> {
  const child = spawn(command, args, {
    env: options.env ?? process.env,
    stdio: [options.inputFile ? 'pipe' : 'ignore', 'pipe', 'pipe'],
  });
  let stdout = '';
  let stderr = '';
  child.stderr!.on('data', (chunk: Buffer) => (stderr += chunk.toString('utf8')));
  const exited = new Promise<number | null>((resolve, reject) => {
    child.on('error', reject);
    child.on('close', resolve);
  });
  const streams: Promise<void>[] = [];
  if (options.inputFile) streams.push(pipeline(createReadStream(options.inputFile), child.stdin!));
  if (options.outputFile) streams.push(pipeline(child.stdout!, createWriteStream(options.outputFile)));
  else child.stdout!.on('data', (chunk: Buffer) => (stdout += chunk.toString('utf8')));
  const [code] = await Promise.all([exited, ...streams.map((stream) => stream.catch(() => undefined))]);
  if (code !== 0) {
    throw new Error(`${command.split('/').pop()} failed (exit ${code}): ${stderr.trim() || 'no message'}`);
  }
  return stdout;
}
