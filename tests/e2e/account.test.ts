/**
 * Browser tests of the account pages in Chromium against the real app:
 * sign up, change the display name on the account page (the top bar shows
 * it at once), sign out, ask for a password reset, follow the mailed link
 * from the development outbox, choose a new password and sign in with it.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { shot, startHarness, type Harness } from './harness.ts';

let h: Harness;

beforeAll(async () => {
  h = await startHarness();
}, 180_000);

afterAll(async () => {
  await h?.stop();
});

describe('account pages in Chromium', () => {
  it('signs up, resets the password through the mailed link in the outbox, and signs in with the new one', async () => {
    const email = `wren.calloway.${Date.now()}@saltmarsh.example`;
    const page = await h.context.newPage();

    await page.goto(`${h.baseUrl}/sign-up`);
    await page.getByLabel('Your name').fill('Wren Calloway');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('short');
    await page.getByRole('button', { name: 'Create account' }).click();
    // The API's rule (at least 10 characters) is said before anything is sent.
    await page.getByText('Use at least 10 characters.').first().waitFor();
    await page.getByLabel('Password').fill('first-tide-pool');
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.waitForURL(/\/patterns$/);
    await page.getByRole('heading', { name: 'No patterns yet' }).waitFor();
    await shot(page, '06-library-empty');

    await page.getByRole('link', { name: /Account settings/ }).click();
    await page.getByText(email).first().waitFor();
    // A new display name shows in the top bar without a reload (the cached /api/me answer is replaced).
    await page.getByLabel('Display name').fill('Wren Calloway Marsh');
    await page.getByRole('button', { name: 'Save name' }).click();
    await page.getByText('You now appear as Wren Calloway Marsh.').waitFor();
    expect(await page.getByRole('link', { name: /Account settings/ }).textContent()).toContain('Wren Calloway Marsh');
    await shot(page, '06b-account');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);

    // A wrong password gets the server's plain-words answer.
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect.poll(() => page.getByRole('alert').textContent()).toMatch(/\w+/);

    await page.getByRole('link', { name: 'Forgotten your password?' }).click();
    // The reset page is loaded lazily and the sign-in page also has an
    // E-mail field: wait for the new page before typing into it.
    await page.waitForURL(/\/reset-password$/);
    await page.getByRole('heading', { name: 'Reset your password' }).waitFor();
    await page.getByLabel('E-mail').fill(email);
    await page.getByRole('button', { name: 'Send reset link' }).click();
    await page.getByText('a reset link is on its way').waitFor();

    await page.goto(`${h.baseUrl}/dev/outbox`);
    const message = page.getByRole('listitem').filter({ hasText: `To ${email}` }).first();
    await message.waitFor({ timeout: 15_000 });
    await shot(page, '07-outbox');
    await message.getByRole('link').filter({ hasText: '/reset-password/' }).first().click();
    await page.waitForURL(/\/reset-password\/[^/]+$/);

    await page.getByLabel('New password', { exact: true }).fill('second-tide-pool');
    await page.getByLabel('Repeat the new password').fill('second-tide-poo');
    await page.getByRole('button', { name: 'Set new password' }).click();
    await page.getByText('The two passwords differ.').waitFor();
    await page.getByLabel('Repeat the new password').fill('second-tide-pool');
    await page.getByRole('button', { name: 'Set new password' }).click();
    await page.getByText('Your password has been changed').waitFor();

    await page.goto(`${h.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('second-tide-pool');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/\/patterns$/);
    await page.getByRole('link', { name: /Account settings/ }).waitFor();
    expect(await page.getByRole('link', { name: /Account settings/ }).textContent()).toContain('Wren Calloway Marsh');

    // The address was told of the change.
    await page.goto(`${h.baseUrl}/dev/outbox`);
    await page.getByRole('listitem').filter({ hasText: `To ${email}` }).filter({ hasText: 'Your Loopwright password was changed' }).first().waitFor({ timeout: 15_000 });
    await page.close();
  }, 120_000);
});
