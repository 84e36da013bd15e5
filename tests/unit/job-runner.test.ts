import { describe, expect, it } from 'vitest';
import { JOB_STALE_MS, parseRunner, runnerText, stuckReason } from '@/lib/job-runner';

const self = { host: 'app1', pid: 4242, boot: 'now1' };
const now = new Date('2026-12-03T10:00:00Z');
const minutesAgo = (m: number) => new Date(now.getTime() - m * 60_000);
const job = (over: Partial<Parameters<typeof stuckReason>[0]> = {}) => ({ status: 'applying', runner: 'app1:4242:now1', heartbeatAt: minutesAgo(0.2), updatedAt: minutesAgo(0.2), ...over });
const noneAlive = () => false;
const allAlive = () => true;

describe('who runs a dataset job', () => {
  it('writes and reads the runner, a host name with colons included', () => {
    expect(runnerText(self)).toBe('app1:4242:now1');
    expect(parseRunner('app1:4242:now1')).toEqual(self);
    expect(parseRunner('fe80::1:77:b00t')).toEqual({ host: 'fe80::1', pid: 77, boot: 'b00t' });
    expect(parseRunner('garbage')).toBeNull();
    expect(parseRunner(null)).toBeNull();
  });
});

describe('a stuck dataset job', () => {
  it('is never a job that is not running', () => {
    for (const status of ['ready', 'failed', 'applied', 'cancelled']) expect(stuckReason(job({ status, heartbeatAt: minutesAgo(600) }), now, self, noneAlive)).toBeNull();
  });

  it('is not a running job of this very process, nor one of a live process on this host', () => {
    expect(stuckReason(job(), now, self, noneAlive)).toBeNull();
    expect(stuckReason(job({ runner: 'app1:777:other' }), now, self, allAlive)).toBeNull();
  });

  it('is one whose process on this host has exited, at once', () => {
    const why = stuckReason(job({ runner: 'app1:777:old1' }), now, self, noneAlive);
    expect(why).toMatch(/^Stopped: the server process running it \(app1, pid 777\) is gone, last heard from 2026-12-03 09:59 UTC; nothing was changed/);
  });

  it('is one left by an earlier start of the app that had the same pid (a restarted container)', () => {
    expect(stuckReason(job({ runner: 'app1:4242:old1' }), now, self, allAlive)).toMatch(/pid 4242\) is gone/);
  });

  it('is one whose heartbeat is older than the limit, on any host', () => {
    expect(JOB_STALE_MS).toBe(5 * 60_000);
    expect(stuckReason(job({ runner: 'app2:1:x', heartbeatAt: minutesAgo(4.9) }), now, self, allAlive)).toBeNull();
    const why = stuckReason(job({ status: 'reading', runner: 'app2:1:x', heartbeatAt: minutesAgo(5.1) }), now, self, allAlive);
    expect(why).toMatch(/^Stopped: no sign of the server running it for over 5 minutes \(last heard from 2026-12-03 09:54 UTC\); nothing was loaded; upload the files again\.$/);
  });

  it('falls back on the last update for a row without a runner or heartbeat (written before either existed)', () => {
    expect(stuckReason(job({ runner: null, heartbeatAt: null, updatedAt: minutesAgo(30) }), now, self, allAlive)).toMatch(/over 5 minutes/);
    expect(stuckReason(job({ runner: null, heartbeatAt: null, updatedAt: minutesAgo(1) }), now, self, allAlive)).toBeNull();
  });
});
