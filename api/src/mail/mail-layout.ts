/**
 * Every e-mail the app sends has one shape: a heading, a few paragraphs, and at most one action
 * link. Written once here so that the text and HTML bodies say the same thing and every value
 * put into the HTML is escaped.
 */
export interface MailContent {
  subject: string;
  heading: string;
  paragraphs: string[];
  action?: { label: string; url: string };
  /** A closing line, e.g. why the reader got this message and how to stop it. */
  footer?: string;
}

export interface RenderedMail {
  subject: string;
  text: string;
  html: string;
}

const HTML_ESCAPES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => HTML_ESCAPES[c]);
}

export function renderMail(content: MailContent): RenderedMail {
  const text = [
    content.heading,
    '',
    ...content.paragraphs.flatMap((p) => [p, '']),
    ...(content.action ? [`${content.action.label}: ${content.action.url}`, ''] : []),
    ...(content.footer ? ['--', content.footer] : []),
  ].join('\n').trimEnd() + '\n';
  const html = [
    '<!doctype html><html><body style="font-family: sans-serif; line-height: 1.5; color: #1d2433; max-width: 36em">',
    `<h1 style="font-size: 1.25em">${escapeHtml(content.heading)}</h1>`,
    ...content.paragraphs.map((p) => `<p>${escapeHtml(p)}</p>`),
    ...(content.action
      ? [`<p><a href="${escapeHtml(content.action.url)}" style="color: #0b5d66; font-weight: 600">${escapeHtml(content.action.label)}</a></p>`]
      : []),
    ...(content.footer ? [`<p style="color: #5b6478; font-size: 0.875em">${escapeHtml(content.footer)}</p>`] : []),
    '</body></html>',
  ].join('\n');
  return { subject: content.subject, text, html };
}
