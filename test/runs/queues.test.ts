/** Run settings read from the environment: a bad value falls back to the default, never to nonsense. */
import { describe, expect, it } from 'vitest';
import { runLeaseSeconds, runWriteMs } from '@/src/runs/queues';

describe('run settings', () => {
  it('reads the write interval in milliseconds, 0 included, and ignores what is not a number of at least 0', () => {
    expect(runWriteMs({})).toBeUndefined();
    expect(runWriteMs({ CAVITAS_RUN_WRITE_MS: '0' })).toBe(0);
    expect(runWriteMs({ CAVITAS_RUN_WRITE_MS: '250' })).toBe(250);
    expect(runWriteMs({ CAVITAS_RUN_WRITE_MS: 'soon' })).toBeUndefined();
    expect(runWriteMs({ CAVITAS_RUN_WRITE_MS: '-5' })).toBeUndefined();
    expect(runWriteMs({ CAVITAS_RUN_WRITE_MS: ' ' })).toBeUndefined();
  });

  it('reads the lease in seconds, falling back to 30', () => {
    expect(runLeaseSeconds({})).toBe(30);
    expect(runLeaseSeconds({ CAVITAS_RUN_LEASE_S: '3' })).toBe(3);
    expect(runLeaseSeconds({ CAVITAS_RUN_LEASE_S: '0' })).toBe(30);
  });
});
