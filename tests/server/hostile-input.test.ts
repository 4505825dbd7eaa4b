import type { AddressInfo } from 'node:net';
import { describe, expect, it } from 'vitest';
import { demoAccounts } from '../../server/seed/demo-staff';
import { hostileStrings, nonUtf8Body } from '../support/hostile-strings';
import { bodyWith } from '../support/request-bodies';
import { demoAgentsByRole, jsonBodyRoutes, seededOutlet, send } from './support/seeded-outlet';

/**
 * The hostile-string corpus sent to every text field of every JSON body route the OpenAPI document lists, on a
 * seeded demo outlet of this file's own. Whatever a route does with it, it never answers 5xx; a refusal is 400
 * with a message per field; a value the route accepts comes back in the JSON answer exactly as sent and sits in
 * MariaDB exactly as sent (a binary comparison, so no collation folds it). Update routes take a body with the one
 * field, so every editable text field of the demo's first rows is accepted or refused on its own merits.
 */

interface JsonSchema {
  type?: string | string[];
  properties?: Record<string, JsonSchema>;
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  allOf?: JsonSchema[];
  'x-text'?: string;
  format?: string;
  enum?: unknown[];
}

function variants(schema: JsonSchema): JsonSchema[] {
  const options = schema.anyOf ?? schema.oneOf ?? schema.allOf;
  return options ? options.flatMap(variants) : [schema];
}

/** Free-text string fields (not enums, dates, e-mails or passwords) at any depth, as paths. */
function textFields(schema: JsonSchema, path: string[] = []): string[][] {
  const found: string[][] = [];
  for (const variant of variants(schema)) {
    if (variant.type === 'string' && !variant.enum && !variant.format && variant['x-text'] !== 'password') {
      found.push(path);
    }
    for (const [name, property] of Object.entries(variant.properties ?? {})) {
      found.push(...textFields(property, [...path, name]));
    }
  }
  return found;
}

/** Routes that check or analyse what they are sent and store nothing (previews). */
const checksOnly = (path: string) => /\/(preview|analyse)$/.test(path);

/** Every string anywhere in a JSON value. */
function stringsIn(value: unknown, into: string[] = []): string[] {
  if (typeof value === 'string') into.push(value);
  else if (Array.isArray(value)) value.forEach((item) => stringsIn(item, into));
  else if (value && typeof value === 'object') Object.values(value).forEach((item) => stringsIn(item, into));
  return into;
}

const outlet = seededOutlet('hostile');

let textColumns: { tableName: string; columnName: string }[] | null = null;

/** Whether some text column of some table holds exactly this value (binary comparison). */
async function storedExactly(value: string): Promise<boolean> {
  const dataSource = outlet.dataSource();
  textColumns ??= await dataSource.query(
    `SELECT TABLE_NAME AS tableName, COLUMN_NAME AS columnName FROM information_schema.COLUMNS
     WHERE TABLE_SCHEMA = DATABASE() AND DATA_TYPE IN ('varchar', 'char', 'text', 'mediumtext', 'longtext', 'tinytext')`,
  );
  for (const { tableName, columnName } of textColumns!) {
    const [{ hits }] = await dataSource.query(
      `SELECT COUNT(*) AS hits FROM \`${tableName}\` WHERE CAST(\`${columnName}\` AS BINARY) = CAST(? AS BINARY)`,
      [value],
    );
    if (Number(hits) > 0) return true;
  }
  return false;
}

describe('hostile text in every JSON body field', () => {
  it('never a 5xx; refusals name the field; accepted text comes back and is stored exactly as sent', async () => {
    const app = outlet.app({ SIGN_IN_LIMIT_PER_ACCOUNT: '100000', SIGN_IN_LIMIT_PER_IP: '100000' });
    const agents = await demoAgentsByRole(app);

    const problems: string[] = [];
    const accepted = new Map<string, string>();
    let sent = 0;
    for (const { path, method, roles, schema, address } of await jsonBodyRoutes<JsonSchema>(agents.get('editor')!)) {
      // Signing out or in would end the sessions the sweep runs on; those bodies hold no stored text anyway.
      if (path.startsWith('/api/auth/')) continue;
      const role = ['editor', 'tester', 'admin', 'writer'].find((r) => roles.includes(r));
      const agent = agents.get(role ?? 'editor')!;
      for (const field of textFields(schema)) {
        for (const hostile of hostileStrings) {
          const response = await send(agent, method, address, bodyWith(field, hostile.value));
          sent += 1;
          const label = `${method.toUpperCase()} ${path} ${field.join('.')} ← ${hostile.name}`;
          if (response.status >= 500) {
            problems.push(`${label}: ${response.status} ${response.text.slice(0, 160)}`);
          } else if (response.status === 400) {
            const fields = response.body.error?.fields ?? {};
            const messages = Object.values(fields);
            if (messages.length === 0 || messages.some((m) => typeof m !== 'string' || m.length === 0)) {
              problems.push(`${label}: 400 without field messages: ${response.text.slice(0, 160)}`);
            }
          } else if (response.status < 300) {
            // Multi-line text keeps its lines with one line ending, LF (common practice, no source).
            const kept = hostile.value.replace(/\r\n/g, '\n');
            if (hostile.expect === 'refused') problems.push(`${label}: accepted text the rules refuse`);
            else if (checksOnly(path)) continue;
            else if (!stringsIn(response.body).includes(kept)) {
              problems.push(`${label}: accepted, but the answer does not hold the text as sent`);
            } else {
              // Checked at once: the next string sent to the same field replaces this one.
              accepted.set(kept, label);
              if (!(await storedExactly(kept))) problems.push(`${label}: accepted, but not stored exactly as sent`);
            }
          }
        }
      }
    }
    expect(problems).toEqual([]);
    expect(sent).toBeGreaterThan(200);
    // Text fields that take free text accept the markup-looking kinds (stored inert, escaped when shown).
    expect(accepted.size).toBeGreaterThanOrEqual(5);
  }, 600_000);

  it('a JSON body with bytes that are not UTF-8 is refused with 400 naming the field, never stored', async () => {
    const app = outlet.app();
    // Raw bytes on the wire: a test client would re-encode a string as UTF-8.
    const server = app.listen(0, '127.0.0.1');
    await new Promise((resolve) => server.once('listening', resolve));
    try {
      const origin = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
      const account = demoAccounts.find((a) => a.role === 'editor')!;
      const signIn = await fetch(`${origin}/api/auth/sign-in`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json', Origin: origin },
        body: JSON.stringify({ email: account.email, password: account.password }),
      });
      const cookie = signIn.headers.get('set-cookie')!.split(';')[0];
      const response = await fetch(`${origin}/api/catalog/products/1`, {
        method: 'PATCH',
        headers: { 'Content-Type': 'application/json', Origin: origin, Cookie: cookie },
        body: nonUtf8Body('model'),
      });
      const answer = (await response.json()) as { error: { fields: Record<string, string> } };
      expect(response.status, JSON.stringify(answer)).toBe(400);
      expect(answer.error.fields).toHaveProperty(['model']);
      expect(await storedExactly('Board \uFFFD\uFFFD\uFFFD\uFFFD name')).toBe(false);
    } finally {
      server.close();
    }
  });
});
