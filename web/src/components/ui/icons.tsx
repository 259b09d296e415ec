import { createIcon } from '@chakra-ui/react';

// A handful of line icons drawn for Sixtyfold; stroke uses currentColor so they follow text colour.
const stroke = { fill: 'none', stroke: 'currentColor', strokeWidth: 1.8, strokeLinecap: 'round', strokeLinejoin: 'round' } as const;

export const MenuIcon = createIcon({
  displayName: 'MenuIcon',
  viewBox: '0 0 24 24',
  path: <path {...stroke} d="M4 7h16M4 12h16M4 17h16" />,
});

export const ChevronDownIcon = createIcon({
  displayName: 'ChevronDownIcon',
  viewBox: '0 0 24 24',
  path: <path {...stroke} d="m6 9 6 6 6-6" />,
});

export const ScanGridIcon = createIcon({
  displayName: 'ScanGridIcon',
  viewBox: '0 0 24 24',
  path: (
    <g {...stroke}>
      <rect x="3.5" y="3.5" width="17" height="17" rx="2" />
      <path d="M3.5 9.2h17M3.5 14.8h17M9.2 3.5v17M14.8 3.5v17" />
    </g>
  ),
});

export const CurveIcon = createIcon({
  displayName: 'CurveIcon',
  viewBox: '0 0 24 24',
  path: <path {...stroke} d="M3 20c4 0 5-14 9-14s4 8 9 8" />,
});

export const CompareIcon = createIcon({
  displayName: 'CompareIcon',
  viewBox: '0 0 24 24',
  path: (
    <g {...stroke}>
      <rect x="3.5" y="4.5" width="7" height="15" rx="1.5" />
      <rect x="13.5" y="4.5" width="7" height="15" rx="1.5" />
    </g>
  ),
});

export const LockIcon = createIcon({
  displayName: 'LockIcon',
  viewBox: '0 0 24 24',
  path: (
    <g {...stroke}>
      <rect x="5" y="10.5" width="14" height="10" rx="2" />
      <path d="M8 10.5V7.5a4 4 0 0 1 8 0v3" />
    </g>
  ),
});

export const CompassIcon = createIcon({
  displayName: 'CompassIcon',
  viewBox: '0 0 24 24',
  path: (
    <g {...stroke}>
      <circle cx="12" cy="12" r="8.5" />
      <path d="m15.5 8.5-2 5-5 2 2-5z" />
    </g>
  ),
});

export const UsersIcon = createIcon({
  displayName: 'UsersIcon',
  viewBox: '0 0 24 24',
  path: (
    <g {...stroke}>
      <circle cx="9" cy="8.5" r="3.5" />
      <path d="M2.5 20c.6-3.6 3.2-5.5 6.5-5.5s5.9 1.9 6.5 5.5M15.5 5.2a3.5 3.5 0 0 1 0 6.6M18 14.8c1.9.7 3.1 2.4 3.5 5.2" />
    </g>
  ),
});

export const BellIcon = createIcon({
  displayName: 'BellIcon',
  viewBox: '0 0 24 24',
  path: (
    <g {...stroke}>
      <path d="M6 16.5V11a6 6 0 0 1 12 0v5.5l1.5 2h-15z" />
      <path d="M10 20.5a2 2 0 0 0 4 0" />
    </g>
  ),
});
