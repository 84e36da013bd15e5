/**
 * jsonText (src/server/http.ts): an answer whose JSON is already written, and the work it lets a
 * route run only after the whole body has been read out (the share report stores a new answer
 * then, so the waiting client never waits for the compression and the write).
 */
import { describe, expect, it } from 'vitest';
import { jsonText } from '@/server/http';

const turn = () => new Promise<void>((r) => setImmediate(r));

describe('jsonText', () => {
  it('sends the text as it is, with the JSON headers', async () => {
    const r = jsonText('{"a":"é"}', 201, { vary: 'Accept-Encoding' });
    expect(r.status).toBe(201);
    expect(r.headers.get('content-type')).toBe('application/json; charset=utf-8');
    expect(r.headers.get('cache-control')).toBe('no-store');
    expect(r.headers.get('vary')).toBe('Accept-Encoding');
    expect(await r.json()).toEqual({ a: 'é' });
  });

  it('runs afterSent once, only after the body has been read to its end', async () => {
    let calls = 0;
    const r = jsonText('{"months":[1,2,3]}', 200, {}, () => calls++);
    await turn();
    expect(calls).toBe(0); // nothing read yet
    const reader = r.body!.getReader();
    const first = await reader.read();
    expect(new TextDecoder().decode(first.value)).toBe('{"months":[1,2,3]}');
    await turn();
    expect(calls).toBe(0); // the bytes are out, the end not yet asked for
    expect((await reader.read()).done).toBe(true);
    expect(calls).toBe(0); // on the next turn of the event loop, not inside the read
    await turn();
    expect(calls).toBe(1);
    await turn();
    expect(calls).toBe(1);
  });

  it('runs afterSent when the client goes away before the end, and sends bytes as they are', async () => {
    let calls = 0;
    const r = jsonText(new TextEncoder().encode('{"x":1}'), 200, {}, () => calls++);
    await r.body!.cancel();
    await turn();
    expect(calls).toBe(1);
    expect(await jsonText(new TextEncoder().encode('{"x":1}'), 200, {}, () => calls++).text()).toBe('{"x":1}');
    await turn();
    expect(calls).toBe(2);
  });
});
