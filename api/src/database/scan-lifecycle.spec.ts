import { describe, expect, it } from '@jest/globals';
import { SCAN_STATUSES, type ScanStatus } from '@sixtyfold/shared';
import { checkTransition, IllegalScanTransition, SCAN_TRANSITIONS, type ScanActor, type ScanEvent } from './scan-lifecycle';

const ACTORS: ScanActor[] = ['member', 'owner or lead', 'lead', 'worker', 'reconciler', 'maintenance'];
const FROM: (ScanStatus | 'new')[] = ['new', ...SCAN_STATUSES];

/** The allowed changes, written out by hand: the table must say exactly this. */
const EXPECTED: Record<ScanEvent, { from: (ScanStatus | 'new')[]; by: ScanActor[] }> = {
  submit: { from: ['new'], by: ['member'] },
  draft: { from: ['new'], by: ['member'] },
  start: { from: ['queued'], by: ['worker'] },
  store: { from: ['queued', 'running'], by: ['worker'] },
  finish: { from: ['queued', 'running'], by: ['worker', 'reconciler'] },
  cancel: { from: ['queued', 'running'], by: ['owner or lead'] },
  reopen: { from: ['completed', 'failed', 'cancelled'], by: ['owner or lead'] },
  delete: { from: [...SCAN_STATUSES], by: ['lead', 'maintenance'] },
};

describe('the scan lifecycle table', () => {
  it('has one row per event, and nothing leaves a scan that does not exist but submit and draft', () => {
    expect(SCAN_TRANSITIONS.map((t) => t.event).sort()).toEqual(Object.keys(EXPECTED).sort());
    for (const t of SCAN_TRANSITIONS) {
      if (t.from.includes('new')) expect(['submit', 'draft']).toContain(t.event);
    }
  });

  it('allows exactly the expected (event, from, actor) triples and refuses every other one', () => {
    let allowed = 0;
    let refused = 0;
    for (const t of SCAN_TRANSITIONS) {
      for (const from of FROM) {
        for (const by of ACTORS) {
          const expected = EXPECTED[t.event].from.includes(from) && EXPECTED[t.event].by.includes(by);
          if (expected) {
            expect(() => checkTransition(t.event, from, by)).not.toThrow();
            allowed++;
          } else {
            expect(() => checkTransition(t.event, from, by)).toThrow(IllegalScanTransition);
            refused++;
          }
        }
      }
    }
    // 8 events × 7 statuses × 6 actors, of which the table allows 26 (1 + 1 + 1 + 2 + 4 + 2 + 3 + 12).
    expect(allowed + refused).toBe(8 * 7 * 6);
    expect(allowed).toBe(26);
  });

  it('refuses with a message that names the status, the statuses allowed and the conflict status 409', () => {
    const error = (() => {
      try {
        checkTransition('cancel', 'completed', 'owner or lead');
      } catch (e) {
        return e as IllegalScanTransition;
      }
      throw new Error('cancelling a completed scan was allowed');
    })();
    expect(error.message).toBe('The scan is completed; only queued or running scans can be cancelled');
    expect(error.status).toBe(409);
    expect(() => checkTransition('reopen', 'running', 'owner or lead')).toThrow(
      'The scan is running; only completed, failed or cancelled scans can be reopened for a retry',
    );
    expect(() => checkTransition('start', 'queued', 'member')).toThrow('A scan can be started only by worker, not by member');
    expect(() => checkTransition('finish', 'new', 'worker')).toThrow('A new scan cannot be finished');
  });
});
