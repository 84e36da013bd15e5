/**
 * Bad input, property-based (fast-check): every API route gets generated bodies, query strings,
 * route parameters and (for the import) CSV files — wrong types, control characters, lone UTF-16
 * halves, absurd numbers, broken JSON, wrong content types, fields that do not exist — as the owner
 * of a household, so each request passes the gate and reaches the route's own validation. None may
 * answer 5xx; every 4xx is in the documented shape `{ error: { code, message, fields? } }`
 * (better-auth's own /api/auth/ routes: `{ code?, message }`); a refused import writes nothing.
 *
 * Like the route matrix, a route file or method without a generator below fails the test: a new
 * route joins GENERATORS with the fields it reads. Runs per route: BAD_INPUT_RUNS (default 25);
 * on failure fast-check prints the seed and the shrunk request; BAD_INPUT_DEBUG=1 prints every answer.
 */
import { readdirSync } from 'node:fs';
import { join, relative } from 'node:path';
import { pathToFileURL } from 'node:url';
import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import { grantAdmin } from '@/cli/admin-grant';
import { cropInput, cropPatch } from '@/lib/crop-schemas';
import { cropPinsInput } from '@/lib/crop-pins';
import { datasetOrderBody } from '@/lib/dataset-order';
import { bedInput, fromPlanInput, plantingInput, seasonInput } from '@/lib/bed-schemas';
import { harvestInput, harvestSplitInput, purchaseInput, stapleInput } from '@/lib/entry-schemas';
import { householdPatch, invitationInput } from '@/lib/household-schemas';
import { larderOutcomeInput, larderOutcomesQuery } from '@/lib/larder-schemas';
import { personInput } from '@/lib/people-schemas';
import { planRequest } from '@/lib/plan-schemas';
import { harvestQuery, purchaseQuery } from '@/lib/list-query-schemas';
import { messyQuantity, messyText, pastDate } from '../support/arbitraries';
import { api, BASE_URL, TEST_DB_URL, testPool } from '../support/env';
import { freshLoopbackAddress, requestFrom } from '../support/loopback';
import { foodId } from '../support/entries';
import { apiAs, createHousehold, newVerifiedUser, type TestUser } from '../support/users';

const RUNS = Number(process.env.BAD_INPUT_RUNS ?? 25);
const API_DIR = join(process.cwd(), 'src/pages/api');
const METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE', 'ALL'];

// ── what gets generated ─────────────────────────────────────────────────────────────────────────
const junkScalar: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom(null, true, false, 0, -1, 1.5, 1e-21, 1e308, -1e308, 2 ** 53 + 1, '', ' ', '0x27', '2026-02-30', '9999-12-31', '1e3', 'NaN', 'null', '\u0000', 'a\u0000b', '\ud800', '<script>alert(1)</script>', "'; DROP TABLE harvests; --", '../../etc/passwd', 'x'.repeat(3000)),
  fc.string({ unit: 'binary', maxLength: 20 }),
  fc.integer(),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  messyText(6),
);
const { junk } = fc.letrec<{ junk: unknown }>((tie) => ({
  junk: fc.oneof({ depthSize: 'small', withCrossShrink: true }, junkScalar, fc.array(tie('junk'), { maxLength: 3 }), fc.dictionary(fc.string({ maxLength: 8 }), tie('junk'), { maxKeys: 3 })),
}));

/** Values near what a field wants (so validation is reached field by field), or junk. */
function fieldValue(name: string): fc.Arbitrary<unknown> {
  const near: fc.Arbitrary<unknown> =
    /(^date$|From$|To$|^from$|^to$|^until$|Date$|^sowDate$|^harvest(From|To)$)/.test(name) ? fc.oneof(pastDate, pastDate.map((d) => d.slice(0, 7)), fc.constantFrom('2026-13-01', '12/03/2026'))
    : /Id$/.test(name) ? fc.oneof(fc.integer({ min: -2, max: 5 }), fc.constantFrom(999_999_999, 1.5, '7'))
    : /^(quantity|area|price|lostFraction|edibleFraction|maxAreaM2|ageYears|heightCm|weightKg|kcalPerDay|atHomePct|maxShareOfEnergyPerCrop)$/.test(name) ? messyQuantity
    : /^(unit|areaUnit)$/.test(name) ? fc.constantFrom('g', 'kg', 'oz', 'lb', 'm2', 'ft2', 'KG', 'stone', 'piece', 'ml')
    : /^(name|variety|label|note|notes|token|email|timezone|currency|referenceKey)$/.test(name) ? fc.oneof(messyText(8), fc.constantFrom('Europe/London', 'Asia/Calcutta', 'Mars/Olympus', 'EUR', 'a@b.example'))
    : /^(trimmed|notFood|archived|fedFromHousehold|monthlyLetter)$/.test(name) ? fc.boolean()
    : /^(year|seasonYear|birthYear|yearStartMonth|spreadMonths|defaultSpreadMonths|page|pageSize|slot)$/.test(name) ? fc.integer({ min: -1, max: 2300 })
    : fc.constant(undefined);
  return fc.oneof({ weight: 3, arbitrary: near }, { weight: 2, arbitrary: junk });
}

/** A JSON body over `fields`: known keys with near or junk values, an unknown key now and then, or junk. */
function bodyOver(fields: readonly string[]): fc.Arbitrary<Body> {
  const record = fc
    .tuple(...[...fields, 'extraField'].map((f) => fc.option(fieldValue(f), { nil: undefined, freq: 2 })))
    .map((values) => Object.fromEntries([...fields, 'extraField'].map((f, i) => [f, values[i]]).filter(([, v]) => v !== undefined)));
  return fc.oneof(
    { weight: 6, arbitrary: record.map((value): Body => ({ kind: 'json', value })) },
    { weight: 1, arbitrary: junk.map((value): Body => ({ kind: 'json', value })) },
    { weight: 1, arbitrary: fc.constantFrom<Body>({ kind: 'raw', text: '{"date":', type: 'application/json' }, { kind: 'raw', text: 'date=2026-01-01', type: 'application/x-www-form-urlencoded' }, { kind: 'raw', text: '{}', type: 'text/plain' }, { kind: 'none' }) },
  );
}

/** A query string over `fields` (every value a string, as URLs carry them). */
function queryOver(fields: readonly string[]): fc.Arbitrary<string> {
  const value = fc.oneof(fieldValue(fields[0] ?? 'x').map((v) => (typeof v === 'string' ? v : JSON.stringify(v) ?? '')), messyText(4), fc.constantFrom('', '2026-02', '-date', '1', '0', 'true', '%', '[]'));
  return fc.dictionary(fc.constantFrom(...fields, 'unknown'), value, { maxKeys: fields.length + 1 }).map((d) => new URLSearchParams(d as Record<string, string>).toString());
}

// '.' and '..' are left out: they are dot segments, which the URL parser (here fetch) removes before
// sending — '/api/households/7/harvests/..' is a request to '/api/households/7' itself.
const junkId = fc
  .oneof(fc.constantFrom('0x27', '0', '-1', '1.5', '1e3', '99999999999999999999', 'abc', ' 1', '01', '...', 'null', '%00', '999999999'), fc.string({ maxLength: 10 }), fc.nat().map(String))
  .filter((j) => j !== '.' && j !== '..');

type Body = { kind: 'json'; value: unknown } | { kind: 'raw'; text: string; type: string } | { kind: 'none' };
interface Request {
  method: string;
  params: Record<string, string>;
  query: string;
  body: Body;
}
interface Generator {
  /** Methods to try for an ALL export. */
  methods?: string[];
  body?: fc.Arbitrary<Body>;
  query?: fc.Arbitrary<string>;
  /** Route parameters other than the household's id (junk ids by default). */
  params?: Record<string, fc.Arbitrary<string>>;
  /** The household id param: the fixture's (default) or junk only (for a route that would delete it). */
  householdId?: 'fixture' | 'junk';
  /** Multipart form bodies (the import). */
  multipart?: true;
  /** better-auth's route: its own error shape, and sign-in from fresh addresses. */
  auth?: true;
}

const keysOf = (schema: unknown): string[] => {
  let s = schema as { shape?: object; _zod?: { def?: { in?: unknown; schema?: unknown; innerType?: unknown } } } | undefined;
  for (let i = 0; i < 5 && s && !s.shape; i++) s = (s._zod?.def?.in ?? s._zod?.def?.schema ?? s._zod?.def?.innerType) as typeof s;
  if (!s?.shape) throw new Error('no object shape found in a schema');
  return Object.keys(s.shape);
};
const json = (schema: unknown) => bodyOver(keysOf(schema));
const none = fc.constant<Body>({ kind: 'none' });
const H = 'households/[id]';

// prettier-ignore
const GENERATORS: Record<string, Generator> = {
  'ALL [...rest]':                            { methods: ['GET', 'POST', 'DELETE'], body: bodyOver(['a']), query: queryOver(['a']) },
  'ALL auth/[...all]':                        { methods: ['POST'], auth: true, body: bodyOver(['email', 'password', 'name', 'callbackURL']) },
  'GET foods/[id]':                           { params: { id: junkId } },
  'GET foods/index':                          { query: queryOver(['q', 'code', 'dataset', 'limit', 'branded']) },
  'GET households/index':                     { query: queryOver(['all']) },
  'POST households/index':                    { body: bodyOver(['name', 'timezone', 'units', 'yearStartMonth']) },
  'POST invitations/accept':                  { body: bodyOver(['token']) },
  'POST letters/unsubscribe':                 { query: queryOver(['t']), body: bodyOver(['List-Unsubscribe']) },
  [`GET ${H}/index`]:                         {},
  [`PATCH ${H}/index`]:                       { body: json(householdPatch) },
  [`DELETE ${H}/index`]:                      { householdId: 'junk' },
  [`GET ${H}/members/index`]:                 {},
  [`PATCH ${H}/members/[userId]`]:            { body: bodyOver(['role']) },
  [`DELETE ${H}/members/[userId]`]:           {},
  [`PATCH ${H}/letter`]:                      { body: bodyOver(['monthlyLetter']) },
  [`GET ${H}/invitations/index`]:             {},
  [`POST ${H}/invitations/index`]:            { body: json(invitationInput) },
  [`DELETE ${H}/invitations/[invitationId]`]: {},
  [`GET ${H}/harvests/index`]:                { query: queryOver(keysOf(harvestQuery)) },
  [`POST ${H}/harvests/index`]:               { body: fc.oneof(json(harvestInput), json(harvestSplitInput)) },
  [`GET ${H}/harvests/[harvestId]`]:          {},
  [`PATCH ${H}/harvests/[harvestId]`]:        { body: json(harvestInput) },
  [`DELETE ${H}/harvests/[harvestId]`]:       {},
  [`GET ${H}/purchases/index`]:               { query: queryOver(keysOf(purchaseQuery)) },
  [`POST ${H}/purchases/index`]:              { body: json(purchaseInput) },
  [`GET ${H}/purchases/[purchaseId]`]:        {},
  [`PATCH ${H}/purchases/[purchaseId]`]:      { body: json(purchaseInput) },
  [`DELETE ${H}/purchases/[purchaseId]`]:     {},
  [`GET ${H}/staples/index`]:                 {},
  [`POST ${H}/staples/index`]:                { body: json(stapleInput) },
  [`GET ${H}/staples/[stapleId]/index`]:      {},
  [`DELETE ${H}/staples/[stapleId]/index`]:   {},
  [`POST ${H}/staples/[stapleId]/log`]:       { body: bodyOver(['date']) },
  [`GET ${H}/crops/index`]:                   { query: queryOver(['includeArchived']) },
  [`POST ${H}/crops/index`]:                  { body: json(cropInput) },
  [`GET ${H}/crops/[cropId]`]:                {},
  [`PATCH ${H}/crops/[cropId]`]:              { body: json(cropPatch) },
  [`DELETE ${H}/crops/[cropId]`]:             {},
  [`GET ${H}/people/index`]:                  {},
  [`POST ${H}/people/index`]:                 { body: json(personInput) },
  [`GET ${H}/people/[personId]`]:             {},
  [`PATCH ${H}/people/[personId]`]:           { body: json(personInput) },
  [`DELETE ${H}/people/[personId]`]:          {},
  [`GET ${H}/beds/index`]:                    {},
  [`POST ${H}/beds/index`]:                   { body: json(bedInput) },
  [`GET ${H}/beds/[bedId]`]:                  {},
  [`PATCH ${H}/beds/[bedId]`]:                { body: json(bedInput) },
  [`DELETE ${H}/beds/[bedId]`]:               {},
  [`GET ${H}/plantings/index`]:               { query: queryOver(['year']) },
  [`POST ${H}/plantings/index`]:              { body: json(plantingInput) },
  [`GET ${H}/plantings/[plantingId]`]:        {},
  [`PATCH ${H}/plantings/[plantingId]`]:      { body: json(plantingInput) },
  [`DELETE ${H}/plantings/[plantingId]`]:     {},
  [`POST ${H}/plantings/from-plan`]:          { body: json(fromPlanInput) },
  [`GET ${H}/season`]:                        {},
  [`PUT ${H}/season`]:                        { body: json(seasonInput) },
  [`GET ${H}/share`]:                         { query: queryOver(['from', 'to']) },
  [`GET ${H}/gaps`]:                          { query: queryOver(['year']) },
  [`GET ${H}/larder/index`]:                  {},
  [`POST ${H}/larder/outcomes/index`]:        { body: json(larderOutcomeInput) },
  [`DELETE ${H}/larder/outcomes/[outcomeId]`]:{},
  [`POST ${H}/plan`]:                         { body: json(planRequest) },
  [`POST ${H}/imports/index`]:                { multipart: true },
  [`GET ${H}/larder/outcomes/index`]:         { query: queryOver(keysOf(larderOutcomesQuery)) },
  [`PUT ${H}/crops/pins`]:                    { body: json(cropPinsInput) },
  [`GET ${H}/datasets`]:                      {},
  [`PUT ${H}/datasets`]:                      { body: json(datasetOrderBody) },
  'GET datasets':                             {},
  'GET health':                               {},
  // The fixture's owner is a site administrator too, so these reach their own validation.
  'GET admin/datasets':                       {},
  'GET admin/actions':                        { query: queryOver(['limit', 'before']) },
  'GET admin/outbox':                         { query: queryOver(['status']) },
  'GET admin/accounts/index':                 { query: queryOver(['q']) },
  'PATCH admin/accounts/[userId]/index':      { body: bodyOver(['disabled']) },
  'POST admin/accounts/[userId]/confirmation':{},
  'GET admin/uploads/index':                  {},
  'POST admin/uploads/index':                 { body: bodyOver(['slug', 'name', 'files']) },
  'GET admin/uploads/[jobId]/index':          {},
  'DELETE admin/uploads/[jobId]/index':       {},
  'POST admin/uploads/[jobId]/apply':         {},
  'GET admin/jobs/[jobId]':                   {},
  // Never a real dataset's slug: a reload of SR28 is a real job, not a probe.
  'POST admin/datasets/[slug]/reload':        { params: { slug: fc.oneof(fc.constantFrom('no-such-set', 'SR28', 'sr28 ', '../sr28', '%00'), messyText(2)).filter((x) => x !== 'sr28' && x !== 'ifct2017') } },
  [`GET ${H}/exports/[file]`]:                { params: { file: fc.oneof(fc.constantFrom('harvests.csv', 'purchases.csv', 'crops.csv', 'people.csv', 'backup.json', 'HARVESTS.CSV', '..%2Fpasswd', 'x.csv'), messyText(2)) }, query: queryOver(['delimiter']) },
};

// ── the import's multipart forms ──────────────────────────────────────────────────────────────
const csvCell = fc.oneof(messyText(3), pastDate, messyQuantity.map(String), fc.constantFrom('kg', 'lb', 'stored', 'fresh', 'Potato', '11352', '"', '""', '=1+1', ''));
const csvText = fc
  .tuple(fc.constantFrom('date,crop,quantity,unit,use,note', 'date,food_code,quantity,unit,price,currency', 'Date;Crop;Quantity;Unit', '', 'x'), fc.array(fc.array(csvCell, { maxLength: 7 }), { maxLength: 6 }), fc.constantFrom(',', ';', '\t'), fc.constantFrom('\n', '\r\n', '\r'))
  .map(([header, rows, d, nl]) => [header, ...rows.map((r) => r.join(d))].join(nl));
const importForm = fc.record({
  kind: fc.option(fc.oneof(fc.constantFrom('harvests', 'purchases'), messyText(2)), { nil: undefined }),
  mode: fc.option(fc.oneof(fc.constantFrom('preview', 'commit'), messyText(2)), { nil: undefined }),
  file: fc.option(fc.oneof(csvText, fc.uint8Array({ maxLength: 64 }).map((b) => new TextDecoder('latin1').decode(b))), { nil: undefined }),
  type: fc.constantFrom('text/csv', 'text/plain', 'application/vnd.ms-excel', 'application/octet-stream', 'image/png', ''),
  createCrops: fc.option(fc.oneof(junk.map((j) => JSON.stringify(j) ?? ''), fc.constant('[{"name":')), { nil: undefined }),
});

// ── discovery, as in the route matrix ─────────────────────────────────────────────────────────
function walk(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? walk(join(dir, e.name)) : /\.(ts|js|mts)$/.test(e.name) ? [join(dir, e.name)] : []));
}

async function discover(): Promise<{ key: string; method: string; route: string }[]> {
  const out = [];
  for (const file of walk(API_DIR)) {
    const route = relative(API_DIR, file).replace(/\\/g, '/').replace(/\.(ts|js|mts)$/, '');
    const mod = (await import(pathToFileURL(file).href)) as Record<string, unknown>;
    for (const method of Object.keys(mod).filter((k) => METHODS.includes(k))) out.push({ key: `${method} ${route}`, method, route });
  }
  return out.sort((a, b) => a.key.localeCompare(b.key));
}

/** encodeURIComponent, except that a lone UTF-16 half is sent as its WTF-8 bytes rather than throwing. */
function encodeSegment(text: string): string {
  return text.replace(/[\s\S]/gu, (ch) => {
    const c = ch.charCodeAt(0);
    if (ch.length === 1 && c >= 0xd800 && c <= 0xdfff) return `%ED%${(0xa0 | ((c >> 6) & 0x0f)).toString(16).toUpperCase()}%${(0x80 | (c & 0x3f)).toString(16).toUpperCase()}`;
    return encodeURIComponent(ch);
  });
}

function urlFor(route: string, params: Record<string, string>, query: string): string {
  const path = route
    .split('/')
    .filter((seg, i, all) => !(seg === 'index' && i === all.length - 1))
    .map((seg) => (/^\[\.\.\.\w+\]$/.test(seg) ? (params['...'] ?? 'nothing/here') : seg.replace(/^\[(\w+)\]$/, (_m, name: string) => encodeSegment(params[name] ?? '999999999'))))
    .join('/');
  return `/api/${path}${query ? `?${query}` : ''}`;
}

// ── the fixture and the checks ────────────────────────────────────────────────────────────────
const pool = testPool();
let owner: TestUser;
let hid: number;
/** Ids of the fixture's own records by route parameter name: edits reach their validation with them. */
const realIds: Record<string, string> = {};
const counts = { requests: 0, byStatus: new Map<number, number>() };

// Deletions get junk ids only, so the fixture's records stay for the reads and edits that follow.
const idFor = (name: string, method: string): fc.Arbitrary<string> =>
  realIds[name] && method !== 'DELETE' ? fc.oneof({ weight: 2, arbitrary: fc.constant(realIds[name]!) }, { weight: 1, arbitrary: junkId }) : junkId;

async function rowsOf(householdId: number): Promise<number> {
  const [rows] = await pool.query('SELECT (SELECT COUNT(*) FROM harvests WHERE household_id = ?) + (SELECT COUNT(*) FROM purchases WHERE household_id = ?) + (SELECT COUNT(*) FROM crops WHERE household_id = ?) AS n', [householdId, householdId, householdId]);
  return Number((rows as { n: number }[])[0]!.n);
}

function expectDocumented(status: number, body: unknown, what: string, auth = false) {
  expect(status, `${what} answered ${status}: ${JSON.stringify(body).slice(0, 300)}`).toBeLessThan(500);
  if (status < 400) return;
  if (auth) {
    expect(typeof (body as { message?: unknown })?.message, `${what}: better-auth shape`).toBe('string');
    return;
  }
  const e = (body as { error?: { code?: unknown; message?: unknown; fields?: unknown } })?.error;
  expect(e, `${what} answered ${status} without { error }: ${JSON.stringify(body).slice(0, 300)}`).toBeTypeOf('object');
  expect(e!.code).toMatch(/^[a-z_]+$/);
  expect(typeof e!.message === 'string' && e!.message.length > 0).toBe(true);
  if (e!.fields !== undefined) for (const v of Object.values(e!.fields as object)) expect(typeof v).toBe('string');
}

async function send(gen: Generator, route: string, r: Request): Promise<{ status: number; body: unknown }> {
  const url = urlFor(route, r.params, r.query);
  if (gen.auth) {
    const body = r.body.kind === 'json' ? r.body.value : undefined;
    const a = await requestFrom(freshLoopbackAddress(), r.method, `${url.replace('/nothing/here', '/sign-in/email')}`, body);
    return { status: a.status, body: a.body };
  }
  const headers: Record<string, string> = { cookie: owner.cookie, origin: BASE_URL };
  let payload: BodyInit | undefined;
  if (r.method !== 'GET' && r.method !== 'HEAD') {
    if (r.body.kind === 'json') {
      headers['content-type'] = 'application/json';
      payload = JSON.stringify(r.body.value) ?? 'null';
    } else if (r.body.kind === 'raw') {
      headers['content-type'] = r.body.type;
      payload = r.body.text;
    }
  }
  const res = await api(url, { method: r.method, headers, body: payload });
  return { status: res.status, body: res.body };
}

describe('bad input, generated, on every API route', () => {
  let discovered: { key: string; method: string; route: string }[] = [];
  beforeAll(async () => {
    discovered = await discover();
    owner = await newVerifiedUser({ name: 'Fuzzy owner' });
    await grantAdmin(TEST_DB_URL, owner.email);
    hid = (await createHousehold(owner.cookie, { name: 'Probed plot' })).id;
    const potato = await foodId('11352'); // USDA SR28, NDB 11352 "Potatoes, flesh and skin, raw"
    const made = async (path: string, body: unknown, pick: (b: any) => number) => {
      const r = await apiAs(owner.cookie, 'POST', `/api/households/${hid}/${path}`, body);
      if (r.status !== 201) throw new Error(`fixture ${path} answered ${r.status}: ${JSON.stringify(r.body)}`);
      return String(pick(r.body));
    };
    realIds.cropId = await made('crops', { name: 'Potato', category: 'root_tuber', foodId: potato }, (b) => b.crop.id);
    realIds.harvestId = await made('harvests', { date: '2026-09-01', cropId: Number(realIds.cropId), quantity: 5, unit: 'kg', use: 'stored', spreadMonths: 3 }, (b) => b.harvest.id);
    realIds.purchaseId = await made('purchases', { date: '2026-09-02', foodId: potato, quantity: 2, unit: 'kg' }, (b) => b.purchase.id);
    realIds.stapleId = await made('staples', { foodId: potato, quantity: 2, unit: 'kg' }, (b) => b.staple.id);
    realIds.bedId = await made('beds', { name: 'Bed', area: 4 }, (b) => b.bed.id);
    realIds.plantingId = await made('plantings', { cropId: Number(realIds.cropId), bedId: Number(realIds.bedId), area: 2, seasonYear: 2026 }, (b) => b.planting.id);
    realIds.personId = await made('people', { name: 'Eater', sex: 'female', ageYears: 30 }, (b) => b.person.id);
  });

  it('has a generator for every route file and method, and none for a route that is gone', () => {
    const missing = discovered.filter((d) => !(d.key in GENERATORS)).map((d) => d.key);
    const stale = Object.keys(GENERATORS).filter((k) => !discovered.some((d) => d.key === k));
    expect(missing, `add generators to GENERATORS in tests/integration/bad-input.test.ts for: ${missing.join('; ')}`).toEqual([]);
    expect(stale, `generators name routes that no longer exist: ${stale.join('; ')}`).toEqual([]);
  });

  it('never answers 5xx, and answers every 4xx in the documented shape', { timeout: 240_000 }, async () => {
    for (const { key, method, route } of discovered) {
      const gen = GENERATORS[key];
      if (!gen) continue;
      const paramNames = [...route.matchAll(/\[(\w+)\]/g)].map((m) => m[1]!).filter((n) => !(route.startsWith('households/') && n === 'id'));
      const request = fc.record({
        method: fc.constantFrom(...(method === 'ALL' ? (gen.methods ?? ['GET']) : [method])),
        params: fc.record(Object.fromEntries(paramNames.map((n) => [n, gen.params?.[n] ?? idFor(n, method)])) as Record<string, fc.Arbitrary<string>>),
        householdId: gen.householdId === 'junk' ? junkId.filter((j) => j !== String(hid)) : fc.oneof({ weight: 9, arbitrary: fc.constant(String(hid)) }, { weight: 1, arbitrary: junkId }),
        query: gen.query ?? fc.constant(''),
        body: gen.body ?? none,
        form: gen.multipart ? importForm : fc.constant(undefined),
      });
      await fc.assert(
        fc.asyncProperty(request, async ({ householdId, form, ...r }) => {
          const params = { ...r.params, ...(route.startsWith('households/[id]') ? { id: householdId } : {}) };
          let answer: { status: number; body: unknown };
          if (form) {
            const before = await rowsOf(hid);
            const fd = new FormData();
            if (form.kind !== undefined) fd.set('kind', form.kind);
            if (form.mode !== undefined) fd.set('mode', form.mode);
            if (form.file !== undefined) fd.set('file', new Blob([form.file], { type: form.type }), 'log.csv');
            if (form.createCrops !== undefined) fd.set('createCrops', form.createCrops);
            const res = await api(urlFor(route, params, ''), { method: 'POST', headers: { cookie: owner.cookie, origin: BASE_URL }, body: fd });
            answer = { status: res.status, body: res.body };
            // A refused import writes nothing, not even the crops it was asked to create.
            if (answer.status !== 201) expect(await rowsOf(hid), `${key} refused but wrote rows`).toBe(before);
          } else {
            answer = await send(gen, route, { ...r, params });
          }
          counts.requests += 1;
          if (process.env.BAD_INPUT_DEBUG) console.log(answer.status, key, r.method, urlFor(route, params, r.query).slice(0, 120), JSON.stringify(answer.body).slice(0, 160));
          counts.byStatus.set(answer.status, (counts.byStatus.get(answer.status) ?? 0) + 1);
          expectDocumented(answer.status, answer.body, `${r.method} ${urlFor(route, params, r.query)}`, gen.auth);
        }),
        { numRuns: RUNS },
      );
    }
    console.log(`bad input: ${counts.requests} generated requests on ${discovered.length} route methods, by status: ${JSON.stringify(Object.fromEntries([...counts.byStatus].sort(([a], [b]) => a - b)))}`);
    expect(counts.requests).toBeGreaterThanOrEqual(discovered.length * RUNS);
    await pool.end();
  });
});
