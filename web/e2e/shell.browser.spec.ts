import type { BrowserContext, Page } from 'playwright-core';
import { heading as headingOn, mainNav as mainNavOn, settled as settledOn, shot as shotOn, signIn as signInOn, useBrowserSession, webUrl, DEMO_PASSWORD } from './support/browser';

const email = process.env.SIXTYFOLD_DEMO_EMAIL ?? 'amara.okafor@halvorsen.example';
const password = DEMO_PASSWORD;

let context: BrowserContext;
let page: Page;
useBrowserSession((session) => ({ context, page } = session));

const shot = (name: string) => shotOn(page, name);
const heading = (name: string) => headingOn(page, name);
const mainNav = () => mainNavOn(page);
const settled = () => settledOn(page);
const signIn = (withPassword: string) => signInOn(page, email, withPassword);

describe('Sixtyfold web shell', () => {
  it('signs in, visits the main pages and signs out', async () => {
    await page.goto(`${webUrl}/`);
    await page.waitForURL(/\/sign-in\?next=/);
    await heading('Sign in').waitFor();
    await shot('sign-in');

    await signIn(password);
    await heading('Overview').waitFor();
    expect(new URL(page.url()).pathname).toBe('/');
    await mainNav().getByRole('link', { name: 'Admin', exact: true }).waitFor();
    await settled();
    await shot('overview');

    await mainNav().getByRole('link', { name: 'Scans', exact: true }).click();
    await heading('Scans').waitFor();
    await settled();
    await shot('scans');

    await mainNav().getByRole('link', { name: 'Models', exact: true }).click();
    await heading('Models').waitFor();
    await settled();
    await shot('models');

    await mainNav().getByRole('link', { name: 'Compare', exact: true }).click();
    await heading('Compare').waitFor();
    await settled();
    await shot('compare');

    await mainNav().getByRole('link', { name: 'Admin', exact: true }).click();
    await heading('Admin').waitFor();
    await settled();
    // The demo admin is in the users table the API returned.
    await page.getByRole('region', { name: 'Users' }).getByRole('cell', { name: email, exact: true }).waitFor();
    await shot('admin');

    // Narrow screen: the navigation folds into a menu that still offers Admin.
    await page.setViewportSize({ width: 390, height: 844 });
    await page.getByRole('button', { name: 'Open navigation' }).click();
    await page.getByRole('menuitem', { name: 'Admin', exact: true }).waitFor();
    await shot('admin-narrow-menu');
    await page.keyboard.press('Escape');
    await page.setViewportSize({ width: 1280, height: 860 });

    await page.getByRole('button', { name: /^Account menu for / }).click();
    await page.getByRole('menuitem', { name: 'Sign out', exact: true }).waitFor();
    await shot('user-menu');
    await page.getByRole('menuitem', { name: 'Sign out', exact: true }).click();
    await page.waitForURL(/\/sign-in$/);
    await heading('Sign in').waitFor();

    // The session is really gone: a protected page sends us back to sign-in.
    await page.goto(`${webUrl}/models`);
    await page.waitForURL(/\/sign-in\?next=%2Fmodels$/);
  });

  it('shows the error for a wrong password', async () => {
    // Start without a session, whatever the previous test left behind.
    await context.clearCookies();
    await page.goto(`${webUrl}/sign-in`);
    await heading('Sign in').waitFor();
    await signIn(`${password}-wrong`);
    const alert = page.getByRole('alert');
    await alert.waitFor();
    // A 429 is also a correct answer if the throttle has already kicked in on repeated runs.
    expect(await alert.textContent()).toMatch(/E-mail or password is wrong|Too many attempts, wait a minute/);
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await shot('sign-in-error');
  });
});
