import { describe, expect, it } from 'vitest';
import { browserPlan } from '@/src/ops/test-plan';

describe('browser-test plan', () => {
  it('runs when chromium exists, whatever CI says', () => {
    expect(browserPlan({ CI: 'true' }, true)).toBe('run');
    expect(browserPlan({}, true)).toBe('run');
  });
  it('fails under CI and skips elsewhere when chromium is missing', () => {
    expect(browserPlan({ CI: 'true' }, false)).toBe('fail');
    expect(browserPlan({ CI: '1' }, false)).toBe('fail');
    expect(browserPlan({}, false)).toBe('skip');
    expect(browserPlan({ CI: 'false' }, false)).toBe('skip');
  });
});
