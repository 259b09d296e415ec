import type { ScanProvenanceAnswer } from '@sixtyfold/shared';
import { resolvedEngineOptions } from '@sixtyfold/shared';
import { screen, within } from '@testing-library/react';
import { renderWithProviders } from '@/testing/render';
import { ProvenanceDetails } from './scan-provenance-panel';

const commit = '0123456789abcdef0123456789abcdef01234567';
const run = (chunk: number, worker: string, start: number, end: number) => ({
  chunk, start, end, worker, engineVersion: '0.1.0', commit, node: 'v20.20.2', pointTimeLimitMs: 20_000,
  startedAt: '2026-12-01T10:00:00.000Z', finishedAt: '2026-12-01T10:00:01.000Z',
});

describe('How this was computed', () => {
  it('shows the build, the options, the hash and the chunks summed per worker', () => {
    const provenance: ScanProvenanceAnswer = {
      scanId: 42,
      recorded: { engineVersion: '0.1.0', commit, node: 'v20.20.2', specSha256: 'ab'.repeat(32), engineOptions: resolvedEngineOptions({ method: 'exact', tolerance: 1e-8 }) },
      runsRecorded: true,
      workers: [
        { worker: 'node-a:101', engineVersion: '0.1.0', commit, node: 'v20.20.2', runs: 2, points: 500, firstStartedAt: '2026-12-01T10:00:00.000Z', lastFinishedAt: '2026-12-01T10:00:02.000Z' },
        { worker: 'node-b:202', engineVersion: '0.1.0', commit, node: 'v20.20.2', runs: 1, points: 100, firstStartedAt: '2026-12-01T10:00:00.000Z', lastFinishedAt: '2026-12-01T10:00:01.000Z' },
      ],
      runs: [run(0, 'node-a:101', 0, 250), run(1, 'node-b:202', 250, 350), run(2, 'node-a:101', 350, 600)],
    };
    renderWithProviders(<ProvenanceDetails provenance={provenance} />);
    const panel = screen.getByRole('region', { name: 'How this was computed' });
    expect(within(panel).getAllByText('0123456789ab')[0]).toHaveAttribute('title', commit);
    expect(within(panel).getByText('ab'.repeat(32))).toBeInTheDocument();
    expect(within(panel).getByLabelText('Engine options').textContent).toContain('"tolerance": 1e-8');
    expect(within(panel).getByLabelText('Engine options').textContent).toContain('"stencil": 0.1');
    const workers = within(panel).getByRole('table', { name: 'Workers' });
    expect(within(workers).getAllByRole('row').slice(1).map((r) => within(r).getAllByRole('cell').map((c) => c.textContent))).toEqual([
      ['node-a:101', '0.1.0 0123456789ab', 'v20.20.2', '2', '500'],
      ['node-b:202', '0.1.0 0123456789ab', 'v20.20.2', '1', '100'],
    ]);
    expect(within(panel).getByText('Every chunk run (3)')).toBeInTheDocument();
    expect(within(within(panel).getByRole('table', { name: 'Chunk runs', hidden: true })).getAllByRole('row', { hidden: true })).toHaveLength(4);
  });

  it('says "not recorded" for a scan stored before provenance was, and invents nothing', () => {
    renderWithProviders(<ProvenanceDetails provenance={{ scanId: 7, recorded: null, runsRecorded: false, workers: [], runs: [] }} />);
    const panel = screen.getByRole('region', { name: 'How this was computed' });
    expect(within(panel).getAllByText('not recorded')).toHaveLength(4);
    expect(within(panel).getByText(/Workers: not recorded/)).toBeInTheDocument();
    expect(within(panel).queryByRole('table')).not.toBeInTheDocument();
  });
});
