import type { Page } from 'playwright-core';
import { heading, mainNav, settled, shot, signIn, signOut, webUrl, useBrowserSession } from './support/browser';

// A site admin acts as a lead in every group, so one account sends the invitation and reads the outbox.
const ADMIN = 'amara.okafor@halvorsen.example';
const GROUP = 'Plateau Models';
// The test database keeps what earlier runs created, so the invited address is new every time.
const stamp = new Date().toISOString().replace(/\D/g, '').slice(0, 14);
const NEWCOMER = { email: `new.student.${stamp}@halvorsen.example`, name: `Noor Haddad ${stamp}`, password: 'reheating-check-7' };

let page: Page;
useBrowserSession((session) => (page = session.page));

describe('bringing a newcomer into a group by e-mail', () => {
  it('invites an address, finds the e-mail in the outbox, and the link creates the account in the group', async () => {
    await page.goto(`${webUrl}/sign-in`);
    await signIn(page, ADMIN);
    await heading(page, 'Overview').waitFor();

    await mainNav(page).getByRole('link', { name: 'Groups', exact: true }).click();
    await page.getByRole('table', { name: 'Groups' }).getByRole('link', { name: GROUP, exact: true }).click();
    await heading(page, GROUP).waitFor();
    const invite = page.getByRole('form', { name: 'Invite someone' });
    await invite.getByLabel('E-mail address').fill(NEWCOMER.email);
    await invite.getByLabel('Role').selectOption('member');
    await invite.getByRole('button', { name: 'Send invitation' }).click();
    await page.getByText(`Invitation sent to ${NEWCOMER.email}.`).waitFor();
    await shot(page, 'group-invitation-sent');

    // The mail went over SMTP to the local catcher; the outbox page reads what it stored.
    await mainNav(page).getByRole('link', { name: 'Mail outbox', exact: true }).click();
    const row = page.getByRole('table', { name: 'Caught messages' }).getByRole('row').filter({ hasText: NEWCOMER.email });
    await row.getByRole('link', { name: `invites you to ${GROUP}` }).click();
    const body = page.getByTestId('outbox-text-body');
    const link = body.getByRole('link', { name: /\/invitations\// });
    const href = await link.getAttribute('href');
    expect(href).toMatch(new RegExp(`^${webUrl.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')}/invitations/[^/]+$`));
    // The HTML version renders in its locked-down frame, with the same link.
    const html = page.frameLocator('iframe[title="HTML version of the message"]');
    expect(await html.getByRole('link', { name: 'Accept the invitation' }).getAttribute('href')).toBe(href);
    await shot(page, 'outbox-invitation');
    await signOut(page);

    // The newcomer has no account yet: the link's page creates it and joins the group.
    await page.goto(href!);
    await heading(page, `Join ${GROUP}`).waitFor();
    const form = page.getByRole('form', { name: 'Create your account' });
    await form.getByLabel('Your name').fill(NEWCOMER.name);
    await form.getByLabel('Password').fill(NEWCOMER.password);
    await form.getByRole('button', { name: 'Create account and join' }).click();
    await heading(page, GROUP).waitFor();
    await settled(page);
    await page.getByRole('cell', { name: NEWCOMER.email, exact: true }).waitFor();
    await page.getByRole('button', { name: `Account menu for ${NEWCOMER.name}` }).waitFor();
    await shot(page, 'group-joined');

    // The link was used once; opening it again says so instead of joining twice.
    await page.goto(href!);
    await heading(page, 'This invitation cannot be used').waitFor();
    await page.getByRole('alert').getByText(/already/i).waitFor();

    // And the new account signs in with the password it chose.
    await page.goto(`${webUrl}/`);
    await signOut(page);
    await signIn(page, NEWCOMER.email, NEWCOMER.password);
    await heading(page, 'Overview').waitFor();
  });
});
