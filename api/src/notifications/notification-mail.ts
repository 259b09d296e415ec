import type { NotificationEmailMode, NotificationKind, NotificationPayload } from '@sixtyfold/shared';
import type { MailContent } from '../mail/mail-layout';

/** Path of the preferences page in the web app, where the e-mail choice is changed. */
export const PREFERENCES_PATH = 'preferences';

const KIND_LINES: Record<NotificationKind, (p: NotificationPayload) => string> = {
  scan_completed: (p) => `Your scan "${p.scanName}" has finished: ${p.donePoints ?? 0} point(s) computed${p.failedPoints ? `, ${p.failedPoints} failed` : ''}.`,
  scan_failed: (p) => `Your scan "${p.scanName}" has finished without a single usable point (${p.failedPoints ?? 0} failed).`,
  scan_cancelled: (p) => `Your scan "${p.scanName}" was cancelled${p.actorName ? ` by ${p.actorName}` : ''}.`,
  mentioned: (p) => `${p.actorName} mentioned you in the discussion of "${p.scanName}"${p.pointIndex != null ? ` (point ${p.pointIndex})` : ''}: "${p.excerpt ?? ''}"`,
  invited: (p) => `${p.actorName ? `${p.actorName} invited you` : 'You were invited'} to join ${p.groupName ?? 'a group'}.`,
};

export function notificationLine(kind: NotificationKind, payload: NotificationPayload): string {
  return KIND_LINES[kind](payload);
}

function footer(mode: NotificationEmailMode, preferencesUrl: string): string {
  const how = mode === 'daily' ? 'one digest a day' : 'an e-mail for each notification';
  return `You receive ${how} because of your Sixtyfold notification preference. Change it at ${preferencesUrl}`;
}

/** One notification, sent at once. */
export function singleNotificationMail(kind: NotificationKind, payload: NotificationPayload, link: (path: string) => string): MailContent {
  return {
    subject: `Sixtyfold: ${payload.title}`,
    heading: payload.title,
    paragraphs: [notificationLine(kind, payload)],
    action: payload.link ? { label: 'Open in Sixtyfold', url: link(payload.link) } : undefined,
    footer: footer('immediate', link(PREFERENCES_PATH)),
  };
}

/** Every pending notification of one user, in one message. */
export function digestMail(items: { kind: NotificationKind; payload: NotificationPayload }[], link: (path: string) => string): MailContent {
  return {
    subject: `Sixtyfold: ${items.length} notification${items.length === 1 ? '' : 's'} since the last digest`,
    heading: 'Your daily Sixtyfold digest',
    paragraphs: items.map((n) => `${notificationLine(n.kind, n.payload)}${n.payload.link ? ` ${link(n.payload.link)}` : ''}`),
    action: { label: 'See all notifications', url: link('notifications') },
    footer: footer('daily', link(PREFERENCES_PATH)),
  };
}
