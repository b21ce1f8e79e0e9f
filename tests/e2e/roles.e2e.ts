/** Signing in and out, and what each role may see and do. Every test starts signed out. */
import { describe, expect, it } from 'vitest';
import {
  accounts,
  fieldMessage,
  demoPassword,
  fillSignIn,
  navLink,
  openTeamArea,
  type Role,
  screenshot,
  signIn,
  signOut,
  unique,
  useBrowser,
} from './helpers';

const browser = useBrowser();

describe('signing in and what each role sees', () => {
  it('has banner, area navigation and main landmarks, and a skip link to the main region', async () => {
    const { page } = browser;
    await page.goto('/');
    await page.getByTestId('equation-input').waitFor();
    expect(await page.getByRole('banner').count()).toBe(1);
    expect(await page.getByRole('navigation', { name: 'Areas' }).count()).toBe(1);
    expect(await page.getByRole('main').count()).toBe(1);
    await page.keyboard.press('Tab');
    expect(await page.evaluate(() => document.activeElement?.textContent?.trim())).toBe('Skip to the page');
    await page.keyboard.press('Enter');
    expect(await page.evaluate(() => document.activeElement?.id)).toBe('main');
  });

  it('shows the server’s message inline for a wrong password', async () => {
    const { page } = browser;
    await page.goto('/sign-in');
    await fillSignIn(page, accounts.viewer, 'not-the-password');
    const error = page.getByTestId('sign-in-error');
    await error.waitFor();
    expect(await error.textContent()).toMatch(/E-mail or password is wrong/);
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await screenshot(page, 'sign-in-wrong-password');
  });

  it('puts the schema’s message under an e-mail field that holds no address, and sends nothing', async () => {
    const { page } = browser;
    let sent = 0;
    page.on('request', (r) => {
      if (r.url().endsWith('/api/v1/session') && r.method() === 'POST') sent += 1;
    });
    await page.goto('/sign-in');
    await fillSignIn(page, 'not-an-address', 'whatever');
    const field = page.getByRole('textbox', { name: 'E-mail' });
    await expect.poll(() => fieldMessage(field)).toBe('Give an e-mail address, like name@lab.example.');
    expect(await field.getAttribute('aria-invalid')).toBe('true');
    expect(sent).toBe(0);
  });

  it('sends an anonymous visitor to sign-in and back to the page afterwards', async () => {
    const { page } = browser;
    await page.goto('/account');
    await page.waitForURL((url) => url.pathname === '/sign-in' && url.searchParams.get('redirect') === '/account');
    await fillSignIn(page, accounts.viewer, demoPassword());
    await page.waitForURL(/\/account$/);
    await page.getByRole('heading', { name: 'Account', level: 1 }).waitFor();
  });

  it('shows the viewer team areas without Admin, and the not-allowed view on an admin page', async () => {
    const { page } = browser;
    await signIn(page, 'viewer');
    await page.getByTestId('nav-notes').waitFor({ state: 'attached' });
    expect(await page.getByTestId('nav-members').count()).toBe(1);
    expect(await page.getByTestId('nav-admin').count()).toBe(0);
    await page.goto('/admin/users');
    const forbidden = page.getByTestId('forbidden-view');
    await forbidden.waitFor();
    expect(await forbidden.textContent()).toMatch(/Not allowed.*Site admin/s);
    expect(new URL(page.url()).pathname).toBe('/admin/users');
    await screenshot(page, 'viewer-forbidden');
  });

  it('lets the viewer read notes but offers no edit controls', async () => {
    const { page } = browser;
    await signIn(page, 'viewer');
    await openTeamArea(page, 'notes');
    await page.getByTestId('note-card').first().waitFor();
    expect(await page.getByTestId('note-new').count()).toBe(0);
    expect(await page.getByTestId('note-edit').count()).toBe(0);
    expect(await page.getByTestId('note-delete').count()).toBe(0);
    await screenshot(page, 'viewer-notes');
  });

  it('signs out and leaves the team page', async () => {
    const { page } = browser;
    await signIn(page, 'viewer');
    await openTeamArea(page, 'notes');
    await signOut(page);
    expect(await page.getByTestId('nav-notes').count()).toBe(0);
    await page.goto('/account');
    await page.waitForURL(/\/sign-in/);
  });

  it('lets a member create a note that is still there after a reload', async () => {
    const { page } = browser;
    await signIn(page, 'member');
    await openTeamArea(page, 'notes');
    await page.getByTestId('note-new').click();
    const title = unique('Reflux trial');
    await page.getByTestId('note-title').locator('input').fill(title);
    await page
      .getByTestId('note-body')
      .locator('textarea')
      .fill('Hold the jacket at 65 °C; log the exotherm every minute.');
    await page.getByTestId('note-save').click();
    const card = page.getByTestId('note-card').filter({ hasText: title });
    await card.waitFor();
    expect(await card.getByTestId('note-edit').count()).toBe(1);
    await page.reload();
    await page.getByTestId('note-card').filter({ hasText: title }).waitFor();
    await screenshot(page, 'member-notes');
  });

  it('asks for a note title under the field before saving', async () => {
    const { page } = browser;
    await signIn(page, 'member');
    await openTeamArea(page, 'notes');
    await page.getByTestId('note-new').click();
    await page.getByTestId('note-save').click();
    const title = page.getByRole('textbox', { name: 'Title' });
    await expect.poll(() => fieldMessage(title)).toBe('Give the note a title.');
    expect(await title.getAttribute('aria-invalid')).toBe('true');
  });

  it('lets the site admin read a reset e-mail in the outbox', async () => {
    const { page } = browser;
    // A reset for a demo account does not change its password until the link is used.
    await page.goto('/reset-password');
    await page.getByTestId('reset-email').locator('input').fill(accounts.curator);
    await page.getByRole('button', { name: 'Send the link' }).click();
    await page.getByTestId('reset-sent').waitFor();

    await signIn(page, 'siteAdmin');
    await (await navLink(page, 'admin')).click();
    await page.getByTestId('admin-users-table').waitFor();
    await page.getByRole('link', { name: 'Outbox' }).click();
    const message = page.getByTestId('outbox-message').filter({ hasText: accounts.curator }).first();
    await message.waitFor();
    await message.click();
    const text = page.getByTestId('outbox-text');
    expect(await text.textContent()).toMatch(/\/reset-password\?token=/);
    expect(await text.locator('a').count()).toBeGreaterThan(0);
    await screenshot(page, 'admin-outbox');
  });
});

/** What the header of each role must show: every area link, none clipped, at every width. */
const HEADER_ROLES: { role: Role; areas: string[] }[] = [
  { role: 'viewer', areas: ['workbench', 'library', 'derive', 'calorimetry', 'sets', 'notes', 'members'] },
  {
    role: 'member',
    areas: ['workbench', 'library', 'derive', 'calorimetry', 'sets', 'amendments', 'notes', 'members'],
  },
  {
    role: 'teamAdmin',
    areas: ['workbench', 'library', 'derive', 'calorimetry', 'sets', 'amendments', 'notes', 'members'],
  },
  {
    role: 'curator',
    areas: ['workbench', 'library', 'derive', 'calorimetry', 'sets', 'amendments', 'notes', 'members'],
  },
  { role: 'siteAdmin', areas: ['workbench', 'library', 'derive', 'calorimetry', 'admin'] },
];
const HEADER_WIDTHS = [1440, 1280, 1024, 768, 390];

describe('the header at every width', () => {
  for (const { role, areas } of HEADER_ROLES) {
    it(`shows every area of ${role} unclipped from 1440 to 390 px, the rest under More, the page marked`, async () => {
      const { page } = browser;
      await signIn(page, role);
      // A team page, so the current page is marked wherever its link sits.
      const start = areas.includes('members') ? 'members' : 'admin';
      await (await navLink(page, start)).click();
      await page.waitForURL(start === 'members' ? /\/members$/ : /\/admin\//);
      for (const width of HEADER_WIDTHS) {
        await page.setViewportSize({ width, height: 800 });
        // The row is laid out again after a resize observer's callback.
        await expect
          .poll(async () => {
            const problems = await page.evaluate(() => {
              const out: string[] = [];
              const viewport = document.documentElement.clientWidth;
              const nav = document.querySelector('nav[aria-label="Areas"]')!;
              const navBox = nav.getBoundingClientRect();
              const others = [
                ...document.querySelectorAll(
                  '[data-testid="team-switcher"], [data-testid="team-name"], [data-testid="account-menu"], [data-testid="theme-toggle"]',
                ),
              ]
                .map((el) => el.getBoundingClientRect())
                .filter((r) => r.width > 0);
              const inRow = [...nav.querySelectorAll(':scope > a, :scope > .more > button')];
              for (const el of inRow) {
                const r = el.getBoundingClientRect();
                const name = el.textContent!.trim();
                if (r.width === 0) out.push(`${name} has no size`);
                if (r.left < 0 || r.right > viewport + 0.5) out.push(`${name} leaves the viewport`);
                if (r.right > navBox.right + 0.5) out.push(`${name} is cut off by the nav row`);
                for (const o of others)
                  if (r.right > o.left && r.left < o.right && r.bottom > o.top && r.top < o.bottom)
                    out.push(`${name} lies under the team name or account menu`);
              }
              // The header itself never scrolls or overflows (a page's own content is its own matter).
              const header = document.querySelector('header')!;
              if (header.scrollWidth > header.clientWidth + 1) out.push('the header overflows');
              if (header.getBoundingClientRect().right > viewport + 0.5)
                out.push('the header is wider than the window');
              return out;
            });
            return problems;
          })
          .toEqual([]);
        // Every area is reachable: in the row, or under More.
        for (const key of areas) expect(await page.getByTestId(`nav-${key}`).count(), `${key} at ${width}`).toBe(1);
        // The page shown is marked, in the row.
        const current = page.locator('nav[aria-label="Areas"] > a[aria-current="page"]');
        expect(await current.count(), `current page at ${width}`).toBe(1);
        expect(await current.getAttribute('data-testid')).toBe(`nav-${start}`);
        await screenshot(page, `header-${role}-${width}`);
      }
      // More opens from the keyboard, its links are reachable with Tab, and Escape closes it.
      const more = page.getByTestId('nav-more');
      await more.focus();
      await page.keyboard.press('Enter');
      expect(await more.getAttribute('aria-expanded')).toBe('true');
      await page.keyboard.press('Tab');
      const focused = await page.evaluate(() => document.activeElement?.getAttribute('data-testid') ?? '');
      expect(focused).toMatch(/^nav-/);
      await page.keyboard.press('Escape');
      expect(await more.getAttribute('aria-expanded')).toBe('false');
      expect(await page.evaluate(() => document.activeElement?.getAttribute('data-testid'))).toBe('nav-more');
    });
  }
});
