// The stored share answer as the gate's one subquery sends it: flag, context, NUL, bytes (src/server/share-cache.ts).
import { gzipSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { storedParts } from '@/server/share-cache';

const context = '2026-01|2026-12|2026-12|Europe/London||2025-03-01T10:00:00.000Z';

describe('storedParts', () => {
  it('reads the gzip copy whole, NUL bytes inside it included', () => {
    const body = gzipSync('{"months":[]}');
    expect(body.includes(0)).toBe(true);
    const parts = storedParts(Buffer.concat([Buffer.from('1' + context), Buffer.from([0]), body]));
    expect(parts).not.toBeNull();
    expect(parts!.gzip).toBe(true);
    expect(parts!.context).toBe(context);
    expect(Buffer.compare(parts!.body, body)).toBe(0);
  });

  it('reads the plain copy and a context written in UTF-8', () => {
    const ctx = 'Ålesund|2026-01';
    const parts = storedParts(Buffer.concat([Buffer.from('0' + ctx), Buffer.from([0]), Buffer.from('{"a":"é"}')]));
    expect(parts).toEqual({ gzip: false, context: ctx, body: Buffer.from('{"a":"é"}') });
  });

  it('is null for no stored answer, and for one it cannot read (worked out afresh, never a 500)', () => {
    expect(storedParts(null)).toBeNull();
    expect(storedParts(Buffer.from('1abc'))).toBeNull();
  });
});
