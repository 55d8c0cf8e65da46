// WORKERS as the README documents it: all (the default), none (web only, also spelled off), only (workers alone).
import { describe, expect, it } from 'vitest';
import { workerMode } from '../../server/jobs/worker-mode.ts';

describe('WORKERS', () => {
  it('runs web and workers together when unset or all', () => {
    expect(workerMode(undefined)).toBe('all');
    expect(workerMode(' ALL ')).toBe('all');
  });

  it('runs the web alone with none or off, and the workers alone with only', () => {
    expect(workerMode('none')).toBe('none');
    expect(workerMode('off')).toBe('none');
    expect(workerMode('only')).toBe('only');
  });

  it('refuses a value it does not know, naming the ones it does', () => {
    expect(() => workerMode('web')).toThrow(/all .* none .* only/);
  });
});
