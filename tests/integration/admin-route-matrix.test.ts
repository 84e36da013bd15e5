/**
 * THE ADMIN ROUTE MATRIX: every /api/admin route and /admin page × {signed out, an ordinary
 * member of a household, a site administrator}. Everyone but an administrator gets 404 — the same
 * answer as a page that does not exist — and the administrator gets the row's status.
 *
 * A new admin route or page joins with one row in ROUTES (method, path under src/pages, the
 * administrator's status, optional body). The test fails for a route file or method without a row,
 * for a row naming something gone, and for an API handler not made by adminRoute()
 * (src/server/admin.ts), which marks its handlers with ADMIN_GUARDED.
 */
import { readdirSync } from 'node:fs';
import { join, relative } from 'node:path';
import { pathToFileURL } from 'node:url';
import { beforeAll, describe, expect, it } from 'vitest';
import { grantAdmin } from '@/cli/admin-grant';
import { ADMIN_GUARDED } from '@/server/admin';
import { TEST_DB_URL } from '../support/env';
import { apiAs, householdWithRoles, newVerifiedUser, type TestUser } from '../support/users';

type Row = [method: string, path: string, adminStatus: number, body?: unknown];

// prettier-ignore
const ROUTES: Row[] = [
  ['GET',    'pages/admin/index',                           200],
  ['GET',    'pages/admin/accounts',                        200],
  ['GET',    'pages/admin/uploads',                         200],
  ['GET',    'pages/admin/outbox',                          200],
  ['GET',    'pages/api/admin/datasets',                    200],
  ['GET',    'pages/api/admin/actions',                     200],
  ['GET',    'pages/api/admin/outbox',                      200],
  ['GET',    'pages/api/admin/accounts/index',              200],
  ['PATCH',  'pages/api/admin/accounts/[userId]/index',     400],
  ['POST',   'pages/api/admin/accounts/[userId]/confirmation', 404],
  ['GET',    'pages/api/admin/uploads/index',               200],
  ['POST',   'pages/api/admin/uploads/index',               415],
  ['GET',    'pages/api/admin/uploads/[jobId]/index',       404],
  ['DELETE', 'pages/api/admin/uploads/[jobId]/index',       404],
  ['POST',   'pages/api/admin/uploads/[jobId]/apply',       404],
  ['POST',   'pages/api/admin/datasets/[slug]/reload',      404],
  ['GET',    'pages/api/admin/jobs/[jobId]',                404],
];

const SRC = join(process.cwd(), 'src');
const METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE', 'ALL'];

function walk(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? walk(join(dir, e.name)) : [join(dir, e.name)]));
}

/** Every API method and every page under admin, as "METHOD path". */
async function discover(): Promise<{ key: string; guarded: boolean }[]> {
  const out: { key: string; guarded: boolean }[] = [];
  for (const file of walk(join(SRC, 'pages/admin'))) if (file.endsWith('.astro')) out.push({ key: `GET ${relative(SRC, file).replace(/\.astro$/, '')}`, guarded: true });
  for (const file of walk(join(SRC, 'pages/api/admin')).filter((f) => f.endsWith('.ts'))) {
    const mod = (await import(pathToFileURL(file).href)) as Record<string, unknown>;
    for (const m of Object.keys(mod).filter((k) => METHODS.includes(k))) {
      const h = mod[m];
      out.push({ key: `${m} ${relative(SRC, file).replace(/\.ts$/, '')}`, guarded: typeof h === 'function' && ADMIN_GUARDED in h });
    }
  }
  return out;
}

function urlOf(path: string): string {
  const p = path.replace(/^pages/, '').replace(/\/index$/, '').replace(/\[\w+\]/g, '999999999');
  return p || '/';
}

describe('admin route matrix', () => {
  let admin: TestUser;
  let member: TestUser;

  beforeAll(async () => {
    admin = await newVerifiedUser({ name: 'Matrix Admin' });
    await grantAdmin(TEST_DB_URL, admin.email);
    member = (await householdWithRoles({ name: 'Not admins' })).owner;
  });

  it('has a row for every admin route and page, and every API handler is made by adminRoute()', async () => {
    const found = await discover();
    const rows = new Set(ROUTES.map(([m, p]) => `${m} ${p}`));
    expect(found.filter((d) => !rows.has(d.key)).map((d) => d.key), 'add rows to ROUTES').toEqual([]);
    expect([...rows].filter((k) => !found.some((d) => d.key === k)), 'rows for routes that are gone').toEqual([]);
    expect(found.filter((d) => !d.guarded).map((d) => d.key), 'wrap these in adminRoute()').toEqual([]);
  });

  it.each(ROUTES.map((r) => [`${r[0]} ${r[1]}`, r] as const))('%s: 404 for all but an administrator', async (_label, [method, path, adminStatus, body]) => {
    const url = urlOf(path);
    const send = method === 'GET' || method === 'DELETE' ? undefined : (body ?? {});
    const statuses = {
      signedOut: (await apiAs('', method, url, send)).status,
      member: (await apiAs(member.cookie, method, url, send)).status,
      admin: (await apiAs(admin.cookie, method, url, send)).status,
    };
    expect(statuses, `${method} ${url}`).toEqual({ signedOut: 404, member: 404, admin: adminStatus });
  });
});
