import { screen } from '@testing-library/react';
import type { ConstraintRegion } from '@sixtyfold/shared';
import { useState } from 'react';
import { renderWithProviders } from '@/testing/render';
import { RegionToggles } from './region-toggles';

const region = (id: number, name: string): ConstraintRegion => ({
  id, groupId: 10, name, source: 'Invented survey DR2', confidenceLevel: 0.95,
  vertices: [{ ns: 0.95, r: 0 }, { ns: 0.97, r: 0 }, { ns: 0.96, r: 0.04 }], createdById: 2, createdAt: '2026-12-01T10:00:00.000Z',
});

function Harness({ onChange }: { onChange: (hidden: number[]) => void }) {
  const [hidden, setHidden] = useState<Set<number>>(new Set());
  return (
    <RegionToggles
      regions={[region(1, 'Survey A'), region(2, 'Survey B')]}
      hidden={hidden}
      onChange={(next) => {
        setHidden(next);
        onChange([...next]);
      }}
    />
  );
}

describe('constraint region toggles', () => {
  it('lists each region with its confidence level and source, all shown, and hides the one switched off', async () => {
    const changes: number[][] = [];
    const { user } = renderWithProviders(<Harness onChange={(hidden) => changes.push(hidden)} />);

    const a = screen.getByRole('checkbox', { name: 'Survey A (95% CL, Invented survey DR2)' });
    const b = screen.getByRole('checkbox', { name: 'Survey B (95% CL, Invented survey DR2)' });
    expect(a).toBeChecked();
    expect(b).toBeChecked();
    await user.click(b);
    expect(b).not.toBeChecked();
    expect(changes.at(-1)).toEqual([2]);
    await user.click(b);
    expect(changes.at(-1)).toEqual([]);
  });

  it('shows nothing when the group has no regions', () => {
    renderWithProviders(<RegionToggles regions={[]} hidden={new Set()} onChange={() => {}} />);
    expect(screen.queryByText('Your group’s constraint regions')).not.toBeInTheDocument();
    expect(screen.queryByRole('checkbox')).not.toBeInTheDocument();
  });
});
