import { describe, expect, it } from 'vitest';
import { demoAgentsByRole, jsonBodyRoutes, seededOutlet, send } from './support/seeded-outlet';

/**
 * Mass assignment: every JSON body route, called by every role it admits, with fields a caller must never set
 * through a form (ids, roles, approval, publication, states, authorship, timestamps). Bodies are strict, so each
 * is refused with 400 naming every such field, and the database — the seeded demo outlet on a database of this
 * file's own — is byte for byte what it was (CHECKSUM TABLE on every table).
 */

const forbiddenFields = {
  id: 999,
  role: 'admin',
  approved: true,
  approvedAt: '2026-01-01T00:00:00.000Z',
  publishedAt: '2026-01-01T00:00:00.000Z',
  state: 'live',
  active: true,
  createdBy: 1,
  createdAt: '2026-01-01T00:00:00.000Z',
  updatedAt: '2026-01-01T00:00:00.000Z',
  userId: 1,
  testerId: 1,
  reviewedBy: 1,
  reviewState: 'accepted',
  passwordHash: 'x',
  isRunOfRecord: true,
};

interface JsonSchema {
  properties?: Record<string, unknown>;
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  allOf?: JsonSchema[];
}

/** Top-level field names a body schema declares, across its alternatives. */
function declaredFields(schema: JsonSchema | undefined): Set<string> {
  const names = new Set<string>();
  const visit = (node: JsonSchema | undefined) => {
    if (!node) return;
    Object.keys(node.properties ?? {}).forEach((name) => names.add(name));
    [...(node.anyOf ?? []), ...(node.oneOf ?? []), ...(node.allOf ?? [])].forEach(visit);
  };
  visit(schema);
  return names;
}

const outlet = seededOutlet('mass');

async function checksums() {
  const dataSource = outlet.dataSource();
  const tables = (await dataSource.query(
    "SELECT TABLE_NAME AS name FROM information_schema.TABLES WHERE TABLE_SCHEMA = DATABASE() AND TABLE_TYPE = 'BASE TABLE' ORDER BY TABLE_NAME",
  )) as { name: string }[];
  const sums: Record<string, string> = {};
  for (const { name } of tables) {
    const [{ Checksum }] = await dataSource.query(`CHECKSUM TABLE \`${name}\` EXTENDED`);
    sums[name] = String(Checksum);
  }
  return sums;
}

describe('mass assignment', () => {
  it('fields no form may set are refused with 400 on every JSON body route, for every role, and nothing changes', async () => {
    const app = outlet.app({ SIGN_IN_LIMIT_PER_ACCOUNT: '1000' });
    const agents = await demoAgentsByRole(app);
    const routes = await jsonBodyRoutes<JsonSchema>(agents.get('admin')!);
    const before = await checksums();

    const problems: string[] = [];
    let checked = 0;
    for (const { path, method, roles, schema, address } of routes) {
      const declared = declaredFields(schema);
      const body = Object.fromEntries(Object.entries(forbiddenFields).filter(([name]) => !declared.has(name)));
      // The demo outlet's first rows (the address): real objects, so nothing but the body stands in the way.
      const callers = roles.filter((role) => agents.has(role));
      for (const role of callers.length > 0 ? callers : ['admin']) {
        const agent = agents.get(role)!;
        const response = await send(agent, method, address, body);
        checked += 1;
        const label = `${method.toUpperCase()} ${path} as ${role}`;
        if (response.status !== 400) {
          problems.push(`${label}: ${response.status} ${response.text.slice(0, 200)}`);
          continue;
        }
        const named = Object.keys(response.body.error?.fields ?? {});
        const unnamed = Object.keys(body).filter((name) => !named.includes(name));
        if (unnamed.length > 0) problems.push(`${label}: 400 without naming ${unnamed.join(', ')}`);
      }
    }
    expect(problems).toEqual([]);
    expect(checked).toBeGreaterThan(40);
    expect(await checksums()).toEqual(before);
  }, 180_000);
});
