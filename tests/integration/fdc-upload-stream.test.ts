/**
 * The FDC upload's body is streamed to disk, not held in memory: a 38 MB food_nutrient.csv sent as a
 * stream is on disk in the upload folder while the request is still being sent, and is read into
 * the job; a body past the 200 MB limit is refused with 413 as it streams (no Content-Length to go
 * by); an upload broken off halfway leaves no file behind. The CSV rows follow FDC's column layout;
 * the foods and figures are made up for the test (they check the streaming, not any food).
 */
import { readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { grantAdmin } from '@/cli/admin-grant';
import { UPLOAD_MAX_BYTES } from '@/lib/dataset-upload';
import { uploadDir } from '@/server/config';
import { BASE_URL, TEST_DB_URL } from '../support/env';
import { apiAs, newVerifiedUser, type TestUser } from '../support/users';

const SLUG = `fdc-stream-${Date.now().toString(36)}`;
const BOUNDARY = '----selfsown-test-boundary';
const enc = new TextEncoder();
const csv = (rows: (string | number)[][]) => rows.map((r) => r.map((c) => `"${c}"`).join(',')).join('\r\n') + '\r\n';
// Energy (1008) and protein (1003) are nutrients Selfsown keeps; 1051 (water by another method) is one it drops.
const NUTRIENT = csv([['id', 'name', 'unit_name', 'nutrient_nbr', 'rank'], [1008, 'Energy', 'KCAL', '208', 300], [1003, 'Protein', 'G', '203', 600], [1051, 'Water', 'G', '255.1', 100]]);
const FOOD = csv([['fdc_id', 'data_type', 'description', 'food_category_id', 'publication_date'], [991001, 'sr_legacy_food', 'Streamroot, raw', '', '2019-04-01']]);
const AMOUNT_HEADER = '"id","fdc_id","nutrient_id","amount","data_points","derivation_id","min","max","median","footnote","min_year_acquired"\r\n';
const amountRow = (i: number, nutrient: number, amount: number) => `"${i}","991001","${nutrient}","${amount}","","","","","","",""\r\n`;

const fieldPart = (name: string, value: string) => `--${BOUNDARY}\r\nContent-Disposition: form-data; name="${name}"\r\n\r\n${value}\r\n`;
const filePart = (name: string) => `--${BOUNDARY}\r\nContent-Disposition: form-data; name="files"; filename="${name}"\r\nContent-Type: text/csv\r\n\r\n`;
const head = () =>
  Object.entries({ slug: SLUG, name: 'Streamed FDC table', release: 'r1', publisher: 'Test', licence: 'Public domain' }).map(([k, v]) => fieldPart(k, v)).join('') +
  `${filePart('nutrient.csv')}${NUTRIENT}\r\n${filePart('food.csv')}${FOOD}\r\n${filePart('food_nutrient.csv')}${AMOUNT_HEADER}`;

/** Upload folders now in UPLOAD_DIR, with the size of each file in them. */
function folders(): { name: string; files: Record<string, number> }[] {
  let names: string[] = [];
  try {
    names = readdirSync(uploadDir());
  } catch {
    return [];
  }
  // The server removes folders and files while this looks: a vanished one counts as absent.
  const size = (path: string) => {
    try {
      return statSync(path).size;
    } catch {
      return -1;
    }
  };
  const list = (dir: string) => {
    try {
      return readdirSync(dir);
    } catch {
      return [];
    }
  };
  return names.map((name) => ({ name, files: Object.fromEntries(list(join(uploadDir(), name)).map((f) => [f, size(join(uploadDir(), name, f))]).filter(([, n]) => Number(n) >= 0)) }));
}

/** A multipart body made as it is read: `chunks` yields the food_nutrient.csv rows, then the body closes. */
function streamedBody(chunks: () => AsyncGenerator<string>): { body: ReadableStream<Uint8Array>; sent: () => number } {
  let sent = 0;
  let tail: AsyncGenerator<string> | null = null;
  let started = false;
  const body = new ReadableStream<Uint8Array>({
    async pull(controller) {
      if (!started) {
        started = true;
        tail = chunks();
        const first = enc.encode(head());
        sent += first.byteLength;
        return controller.enqueue(first);
      }
      const next = await tail!.next();
      if (next.done) {
        controller.enqueue(enc.encode(`\r\n--${BOUNDARY}--\r\n`));
        return controller.close();
      }
      const bytes = enc.encode(next.value);
      sent += bytes.byteLength;
      controller.enqueue(bytes);
    },
  });
  return { body, sent: () => sent };
}

function post(body: ReadableStream<Uint8Array>, signal?: AbortSignal) {
  return fetch(`${BASE_URL}/api/admin/uploads`, {
    method: 'POST',
    headers: { cookie: admin.cookie, origin: BASE_URL, 'content-type': `multipart/form-data; boundary=${BOUNDARY}` },
    body,
    signal,
    duplex: 'half',
  } as RequestInit);
}

const wait = (ms: number) => new Promise((r) => setTimeout(r, ms));

let admin: TestUser;
beforeAll(async () => {
  admin = await newVerifiedUser({ name: 'Stream Admin' });
  await grantAdmin(TEST_DB_URL, admin.email);
});

describe('a streamed FDC upload', () => {
  it('writes a 38 MB file to disk while it arrives, reads it into the job, then removes it', async () => {
    const ROWS_PER_CHUNK = 20_000;
    const CHUNKS = 40; // 800,000 rows of ~48 bytes: about 38 MB, far more than any buffer the server keeps (64 KB chunks)
    let seenOnDisk = 0;
    let i = 0;
    const { body, sent } = streamedBody(async function* () {
      for (let c = 0; c < CHUNKS; c++) {
        if (c === CHUNKS / 2) {
          // Halfway: the file already lies in an incoming folder, before the request has ended.
          for (let tries = 0; tries < 200 && seenOnDisk < 12 * 1024 * 1024; tries++) {
            seenOnDisk = Math.max(0, ...folders().filter((f) => f.name.startsWith('incoming-')).map((f) => f.files['food_nutrient.csv'] ?? 0));
            if (seenOnDisk < 12 * 1024 * 1024) await wait(50);
          }
        }
        let text = '';
        for (let r = 0; r < ROWS_PER_CHUNK; r++, i++) text += amountRow(i, 1051, 90 + (i % 7)) + (i % 50_000 === 0 ? amountRow(i, 1008, 70) : '');
        yield text;
      }
      yield amountRow(i++, 1003, 2);
    });
    const res = await post(body);
    const answer = (await res.json()) as { upload: { id: number; bytesTotal: number } };
    expect(res.status).toBe(202);
    expect(seenOnDisk).toBeGreaterThan(12 * 1024 * 1024);
    expect(sent()).toBeGreaterThan(36 * 1024 * 1024);

    let job: any;
    for (let t = 0; t < 600; t++) {
      job = (await apiAs(admin.cookie, 'GET', `/api/admin/uploads/${answer.upload.id}`)).body.upload;
      if (job.status !== 'reading') break;
      await wait(100);
    }
    // One food; energy (kept once, the first 70) and protein; the 800,000 rows of nutrient 1051 are dropped.
    expect(job).toMatchObject({ status: 'ready', foodCount: 1, amountCount: 2 });
    expect(job.bytesRead).toBe(job.bytesTotal);
    expect(job.bytesTotal).toBeGreaterThan(36 * 1024 * 1024);
    expect(job.rowsRead).toBeGreaterThan(800_000);
    expect(folders().map((f) => f.name)).not.toContain(`job-${answer.upload.id}`);
    expect((await apiAs(admin.cookie, 'DELETE', `/api/admin/uploads/${answer.upload.id}`)).status).toBe(204);
  }, 120_000);

  it('refuses a body past the limit with 413 while it streams, and keeps nothing of it', async () => {
    const incoming = () => folders().filter((f) => f.name.startsWith('incoming-')).length;
    const before = incoming();
    const chunk = amountRow(0, 1051, 90).repeat(20_000); // ~1 MB
    let answered = false;
    const { body, sent } = streamedBody(async function* () {
      for (let n = 0; n < 400 && !answered; n++) yield chunk; // up to ~400 MB, stopped by the answer
    });
    const res = await post(body);
    answered = true;
    expect(res.status).toBe(413);
    expect(await res.json()).toEqual({ error: { code: 'too_large', message: `The files together are larger than ${UPLOAD_MAX_BYTES / 1024 / 1024} MB.`, fields: { files: 'Too large' } } });
    expect(sent()).toBeGreaterThan(UPLOAD_MAX_BYTES);
    expect(incoming()).toBe(before);
    // The server is still there for the next request.
    expect((await apiAs(admin.cookie, 'GET', '/api/admin/uploads')).status).toBe(200);
  }, 120_000);

  it('removes what arrived of an upload broken off halfway', async () => {
    const abort = new AbortController();
    const { body } = streamedBody(async function* () {
      for (let n = 0; n < 50; n++) {
        if (n === 20) {
          for (let tries = 0; tries < 100 && !folders().some((f) => f.name.startsWith('incoming-')); tries++) await wait(20);
          abort.abort();
          await wait(50);
        }
        yield amountRow(n, 1051, 90).repeat(10_000);
      }
    });
    await expect(post(body, abort.signal)).rejects.toThrow();
    let left = folders().filter((f) => f.name.startsWith('incoming-'));
    for (let tries = 0; tries < 100 && left.length > 0; tries++) {
      await wait(50);
      left = folders().filter((f) => f.name.startsWith('incoming-'));
    }
    expect(left).toEqual([]);
    expect((await apiAs(admin.cookie, 'GET', '/api/admin/uploads')).status).toBe(200);
  }, 60_000);
});
