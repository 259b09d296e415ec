import type { ConstraintRegion } from '@sixtyfold/shared';
import { screen, waitFor } from '@testing-library/react';
// The page composes the regions in; so does this test.
import { useRegionOverlay } from '@/features/constraint-regions/hooks/use-region-overlay';
import { json, mockApi } from '@/testing/mock-api';
import { plotIn } from '@/testing/plotly-chart-mock';
import { renderWithProviders } from '@/testing/render';
import { naturalSpec, scanDetail } from '@/testing/scan-fixtures';
import { ScanPlaneView } from './scan-plane-view';

vi.mock('@/components/plots/plotly-chart', () => import('@/testing/plotly-chart-mock'));

const plane = {
  okPoints: 2, stride: 1, parameters: ['f', 'nStar'], pointIndex: [0, 4], ns: [0.958, 0.9649], r: [0.05, 0.03], alphaS: [-6e-4, -5e-4], nStar: [50, 55],
  inputs: { f: [5, 7], nStar: [50, 55] },
};
const survey: ConstraintRegion = {
  id: 1, groupId: 10, name: 'Survey A', source: 'Invented survey DR2', confidenceLevel: 0.95,
  vertices: [{ ns: 0.955, r: 0 }, { ns: 0.975, r: 0 }, { ns: 0.965, r: 0.04 }], createdById: 2, createdAt: '2026-12-01T10:00:00.000Z',
};

describe('scan n_s–r plane regions', () => {
  it('draws the group’s regions until switched off, and links to where they are uploaded', async () => {
    mockApi({
      'GET /api/scans/42/plane': () => json(200, plane),
      'GET /api/constraint-regions': () => json(200, [survey]),
    });
    const { user } = renderWithProviders(<ScanPlaneView scan={scanDetail()} spec={naturalSpec} useRegionOverlay={useRegionOverlay} />);
    const chart = await screen.findByRole('img', { name: /^n_s–r plane of/ });
    const names = () => plotIn(chart).data.map((trace) => trace.name);

    await waitFor(() => expect(names()).toContain('Survey A (95% CL, Invented survey DR2)'));
    await user.click(screen.getByRole('checkbox', { name: 'Survey A (95% CL, Invented survey DR2)' }));
    await waitFor(() => expect(names()).not.toContain('Survey A (95% CL, Invented survey DR2)'));
    expect(screen.getByRole('link', { name: 'group page' })).toHaveAttribute('href', '/groups/10');
  });
});
