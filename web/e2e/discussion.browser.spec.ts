import type { Page } from 'playwright-core';
import { heading, settled, shot, signIn, signOut, webUrl, useBrowserSession } from './support/browser';

// The lead of "Plateau Models" comments on a heatmap cell and mentions a member of the group.
const LEAD = 'henrik.solberg@halvorsen.example';
const MEMBER = { email: 'lucia.marin@halvorsen.example', name: 'Lucía Marín', handle: 'lucia.marin' };
const GROUP = 'plateau-models';
const stamp = new Date().toISOString().replace(/\D/g, '').slice(0, 14);
const COMMENT = `the ridge at this f is worth a second look ${stamp}`;

let page: Page;
useBrowserSession((session) => (page = session.page));

/** A finished 3 × 3 slow-roll scan of natural inflation, submitted through the API as the signed-in user. */
async function finishedScan(): Promise<number> {
  const me = await (await page.request.get(`${webUrl}/api/auth/me`)).json();
  const groupId = me.memberships.find((m: { groupSlug: string }) => m.groupSlug === GROUP).groupId;
  const created = await page.request.post(`${webUrl}/api/scans`, {
    data: {
      groupId, name: `Discussion check ${stamp}`, model: { kind: 'family', family: 'natural' }, params: {},
      axes: [
        { kind: 'list', parameter: 'f', values: [5, 7, 10] },
        { kind: 'list', parameter: 'nStar', values: [50, 55, 60] },
      ],
      pivot: { kind: 'fixed' }, method: 'slowroll',
    },
  });
  expect(created.status()).toBe(201);
  const id = (await created.json()).id as number;
  await vi.waitFor(async () => expect((await (await page.request.get(`${webUrl}/api/scans/${id}`)).json()).status).toBe('completed'), { timeout: 30_000, interval: 250 });
  return id;
}

describe('discussing a heatmap cell', () => {
  it('comments on a cell with a mention, and the member is notified and lands on that point', async () => {
    await page.goto(`${webUrl}/sign-in`);
    await signIn(page, LEAD);
    await heading(page, 'Overview').waitFor();
    const scanId = await finishedScan();

    await page.goto(`${webUrl}/scans/${scanId}`);
    const nsMap = page.getByRole('img', { name: /^Heatmap of n_s over/ });
    await nsMap.locator('.main-svg').first().waitFor();
    // The middle of the plot is the middle cell of the 3 × 3 grid: f = 7, N_* = 55, point 4.
    await nsMap.locator('.nsewdrag').first().click();
    const drawer = page.getByRole('dialog', { name: /^Point 4/ });
    await drawer.waitFor();
    await settled(page);

    const form = drawer.getByRole('form', { name: 'Add a comment' });
    const box = form.getByRole('textbox', { name: 'Add a comment' });
    await box.pressSequentially('@luc');
    await form.getByRole('listbox', { name: 'People to mention' }).getByRole('option', { name: new RegExp(MEMBER.name) }).waitFor();
    await box.press('Enter');
    expect(await box.inputValue()).toBe(`@${MEMBER.handle} `);
    await box.pressSequentially(COMMENT);
    await form.getByRole('button', { name: 'Post comment' }).click();
    await drawer.getByRole('article', { name: 'Comment by Henrik Solberg' }).filter({ hasText: COMMENT }).waitFor();
    await shot(page, 'point-drawer-comment');
    await page.keyboard.press('Escape');
    await signOut(page);

    await signIn(page, MEMBER.email);
    await heading(page, 'Overview').waitFor();
    await page.getByRole('link', { name: /^Notifications, \d+ unread$/ }).click();
    await heading(page, 'Notifications').waitFor();
    const notice = page.getByRole('list', { name: 'Notifications' }).getByRole('listitem').filter({ hasText: COMMENT }).first();
    await shot(page, 'notifications');
    await notice.getByRole('link').click();
    await page.waitForURL(new RegExp(`/scans/${scanId}/points/4$`));
    await page.getByRole('article', { name: 'Comment by Henrik Solberg' }).filter({ hasText: COMMENT }).waitFor();
  });
});
