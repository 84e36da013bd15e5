import { describe, expect, it } from 'vitest';
import { isLoopback, outboxAllowed } from '@/lib/outbox-access';

const local = { fake: true, bindHost: '127.0.0.1', clientAddress: '127.0.0.1', trustProxy: false };

describe('the development outbox', () => {
  it('opens for a loopback request to an app bound to loopback with the fake mail server', () => {
    expect(outboxAllowed(local)).toBe(true);
    expect(outboxAllowed({ ...local, bindHost: 'localhost', clientAddress: '::1' })).toBe(true);
  });
  it('stays shut when real mail is configured', () => {
    expect(outboxAllowed({ ...local, fake: false })).toBe(false);
  });
  it('stays shut when the app listens on every address', () => {
    expect(outboxAllowed({ ...local, bindHost: '0.0.0.0' })).toBe(false);
    expect(outboxAllowed({ ...local, bindHost: '::' })).toBe(false);
  });
  it('stays shut for a request from another machine, or behind a proxy', () => {
    expect(outboxAllowed({ ...local, clientAddress: '192.0.2.7' })).toBe(false);
    expect(outboxAllowed({ ...local, clientAddress: undefined })).toBe(false);
    expect(outboxAllowed({ ...local, trustProxy: true })).toBe(false);
  });
  it('knows the loopback range 127.0.0.0/8 and ::1 (RFC 1122 §3.2.1.3, RFC 4291 §2.5.3)', () => {
    expect(isLoopback('127.3.2.1')).toBe(true);
    expect(isLoopback('::ffff:127.0.0.1')).toBe(true);
    expect(isLoopback('[::1]')).toBe(true);
    expect(isLoopback('128.0.0.1')).toBe(false);
    expect(isLoopback('127.0.0.1.evil.example')).toBe(false);
  });
});
