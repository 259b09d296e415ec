import type { NotificationDto, NotificationKind } from '@sixtyfold/shared';

export const KIND_LABELS: Record<NotificationKind, string> = {
  scan_completed: 'Scan finished',
  scan_failed: 'Scan failed',
  scan_cancelled: 'Scan cancelled',
  mentioned: 'Mention',
  invited: 'Invitation',
};

/**
 * Where a notification leads inside the app, or null. Payload links are app paths (`/scans/12`);
 * anything else (another site, `//host`) is not followed.
 */
export function notificationTarget(notification: Pick<NotificationDto, 'payload'>): string | null {
  const link = notification.payload.link;
  return link && link.startsWith('/') && !link.startsWith('//') && !link.includes('\\') ? link : null;
}
