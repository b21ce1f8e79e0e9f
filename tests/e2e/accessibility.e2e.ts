/**
 * Every page, as every role, in the light and the dark theme, through axe-core: no critical or
 * serious violation may remain. Each walk signs in on its own and only reads, so walks run in
 * any order. A new page gets a step here (see DEVELOPERS.md → "Adding a page").
 */
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { axeFindings, blocking, logSummary, type AxeFinding } from './axe';
import { apiAs, openTeamArea, signIn, unique, useBrowser, type Role } from './helpers';

interface Step {
  name: string;
  /** Brings the page into the state to check and waits until it shows. */
  open: (page: Page) => Promise<void>;
}

const workbenchBalanced: Step = {
  name: 'workbench, balanced equation',
  open: async (page) => {
    await page.goto('/');
    await page.getByTestId('equation-input').locator('input').fill('2 H2(g) + O2(g) -> 2 H2O(l); ΔH = -571.6 kJ');
    await page.locator('[data-testid="balance-status"][data-status="balanced"]').waitFor();
    await page.getByTestId('balanced-equation').waitFor();
  },
};
const account: Step = {
  name: 'account',
  open: async (page) => {
    await page.goto('/account');
    await page.getByRole('heading', { name: 'Account', level: 1 }).waitFor();
    await page
      .getByText(/No tokens yet|Revoke/)
      .first()
      .waitFor();
    await page.getByTestId('notification-settings').waitFor();
  },
};
const amendmentQueue: Step = {
  name: 'amendments, review queue',
  open: async (page) => {
    await page.goto('/amendments?state=all');
    await page.getByTestId('amendment-queue').or(page.getByTestId('queue-empty')).first().waitFor();
  },
};
const newAmendment: Step = {
  name: 'amendments, new amendment form',
  open: async (page) => {
    await page.goto('/amendments/new');
    await page.getByTestId('new-amendment-form').waitFor();
  },
};
const newAmendmentKinds: Step = {
  name: 'amendments, new amendment with the source and deprecation forms',
  open: async (page) => {
    await page.goto('/amendments/new');
    await page.getByTestId('entry-kind-set-source').click();
    await page.getByTestId('entry-form-set-source').waitFor();
    await page.getByTestId('entry-add').click();
    await page.getByTestId('entry-kind-deprecate').click();
    await page.getByTestId('entry-form-deprecate').waitFor();
  },
};
/** The import page after a refused upload: the progress bar and the report of bad rows. */
const importReport: Step = {
  name: 'amendments, import with a report of bad rows',
  open: async (page) => {
    await page.goto('/amendments/import');
    await page.getByTestId('import-limits').waitFor();
    const csv = [
      'species,property,value,unit,uncertainty_kind,uncertainty,k,source,table,entry_note,provenance,pressure_bar,ion_convention,note',
      'CO2(g),dfH298,minus four,kJ/mol,standard,0.2,,codata-1989,,,entered,1,,',
    ].join('\n');
    await page
      .getByTestId('import-files')
      .setInputFiles({ name: 'values.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    await page.getByTestId('import-start').click();
    await page.getByTestId('import-report').waitFor();
  },
};
const proposeFromSpecies: Step = {
  name: 'species page, propose-a-change form open',
  open: async (page) => {
    await page.goto('/library');
    await page.locator('[data-testid="library-search"] input').fill('ammonia');
    await page.getByTestId('species-row').filter({ hasText: 'NH3(g)' }).first().locator('a.key-link').click();
    await page.getByTestId('propose-change').click();
    await page.getByTestId('propose-form').waitFor();
  },
};
/** An open amendment by the member (made over the API), as the curator reviews it. */
const amendmentPage: Step = {
  name: 'amendment page, open for review',
  open: async (page) => {
    const { api } = await apiAs('member');
    try {
      const species = await (await api.get('/api/v1/species', { params: { q: 'ammonia' } })).json();
      const id = (species as { items: { id: string; key: string }[] }).items.find((s) => s.key === 'NH3(g)')?.id;
      const created = await api.post('/api/v1/amendments', {
        data: {
          title: unique('Accessibility walk'),
          rationale: 'Made by the accessibility walk; never accepted.',
          entries: [
            {
              kind: 'revise-value',
              species: id,
              deltaFH: { value: -45.9, uncertainty: 0.4 },
              source: { citation: 'Accessibility walk citation (invented, not a published value)' },
            },
          ],
        },
      });
      const amendmentId = ((await created.json()) as { id: string }).id;
      await api.post(`/api/v1/amendments/${amendmentId}/open`);
      await page.goto(`/amendments/${amendmentId}`);
      await page.getByTestId('amendment-impact').waitFor();
    } finally {
      await api.dispose();
    }
  },
};
const notes: Step = {
  name: 'team notes',
  open: async (page) => {
    await openTeamArea(page, 'notes');
    await page.getByTestId('note-card').first().waitFor();
  },
};
const noteComposer: Step = {
  name: 'team notes, new-note form open',
  open: async (page) => {
    await openTeamArea(page, 'notes');
    await page.getByTestId('note-new').click();
    await page.getByTestId('note-title').waitFor();
  },
};
const members: Step = {
  name: 'members',
  open: async (page) => {
    await openTeamArea(page, 'members');
    await page.getByTestId('members-table').locator('tbody tr').first().waitFor();
  },
};
const sets: Step = {
  name: 'team reaction sets',
  open: async (page) => {
    await openTeamArea(page, 'sets');
    await page.getByRole('heading', { name: 'Reaction sets', level: 1 }).waitFor();
    await page.getByText(/set\(s\)/).waitFor();
  },
};
const deriveGiven: Step = {
  name: 'derive, a result from given reactions',
  open: async (page) => {
    const query = new URLSearchParams({ t: 'C(cr, graphite) + 1/2 O2(g) -> CO(g)', from: 'given' });
    query.append('r', 'C(cr, graphite) + O2(g) -> CO2(g) ; -393.5 ; 0.1');
    query.append('r', 'CO(g) + 1/2 O2(g) -> CO2(g) ; -283.0');
    await page.goto(`/derive?${query}`);
    await page.getByTestId('level-diagram').waitFor();
  },
};
const teamDerivedValues: Step = {
  name: "team's derived values",
  open: async (page) => {
    await page.goto('/derive');
    await page.getByTestId('derive-team-values-link').click();
    await page.waitForURL(/\/teams\/[^/]+\/derived$/);
    await page
      .getByText(/No derived values yet|Derived ΔfH°/)
      .first()
      .waitFor();
  },
};
const consistency: Step = {
  name: 'consistency check (curators)',
  open: async (page) => {
    await page.goto('/library/consistency');
    await page.getByTestId('consistency-run').waitFor();
  },
};
/** Both calorimetry tabs, each with a reduced run shown (and, signed in, the panel that keeps it). */
const calorimetry: Step = {
  name: 'calorimetry, constant pressure with a result',
  open: async (page) => {
    await page.goto('/calorimetry');
    await page.getByRole('textbox', { name: 'Volume of the solution (mL)' }).fill('200');
    await page.getByRole('textbox', { name: 'Calorimeter heat capacity (J/K)' }).fill('0');
    await page.getByRole('textbox', { name: 'Initial temperature (°C)' }).fill('22.5');
    await page.getByRole('textbox', { name: 'Final temperature (°C)' }).fill('25.86');
    await page.getByRole('textbox', { name: 'Equation as written' }).fill('HCl(aq) + NaOH(aq) -> NaCl(aq) + H2O(l)');
    await page.getByRole('textbox', { name: 'Amount of the limiting reactant (mol)' }).fill('0.05');
    await page.getByTestId('cp-reduce').click();
    await page.getByTestId('cp-deltaH').waitFor();
  },
};
const calorimetryBomb: Step = {
  name: 'calorimetry, bomb tab with a result',
  open: async (page) => {
    await page.getByText('Bomb (constant volume)', { exact: true }).click();
    await page.getByRole('textbox', { name: 'Sample formula' }).fill('C10H8');
    // Scoped: the constant-pressure tab has a 'Typed' choice of its own, still in the page while the tabs switch.
    await page.getByLabel('Energy equivalent').getByText('Typed', { exact: true }).click();
    await page.getByRole('textbox', { name: 'Energy equivalent (J/K)' }).fill('10170');
    await page.getByRole('textbox', { name: 'Sample runs, run 1: Mass (g)' }).fill('1.435');
    await page.getByRole('textbox', { name: 'Sample runs, run 1: Corrected rise (K)' }).fill('5.67');
    await page.getByRole('button', { name: 'Reduce the runs' }).click();
    await page.getByTestId('bomb-result').waitFor();
  },
};

const adminPage = (path: string, name: string, ready: (page: Page) => Promise<void>): Step => ({
  name,
  open: async (page) => {
    await page.goto(path);
    await ready(page);
  },
});

/** What each role can open; anonymous visitors also see the public forms and the error pages. */
const walks: Record<Role | 'anonymous', Step[]> = {
  anonymous: [
    workbenchBalanced,
    deriveGiven,
    calorimetry,
    calorimetryBomb,
    {
      name: 'sign-in',
      open: async (page) => {
        await page.goto('/sign-in');
        await page.getByTestId('sign-in-submit').waitFor();
      },
    },
    {
      name: 'reset password, ask for a link',
      open: async (page) => {
        await page.goto('/reset-password');
        await page.getByTestId('reset-email').waitFor();
      },
    },
    {
      name: 'reset password, choose a new one',
      open: async (page) => {
        await page.goto('/reset-password?token=not-a-real-token-but-long-enough');
        await page.getByRole('heading', { name: 'Choose a new password' }).waitFor();
      },
    },
    {
      name: 'invitation that does not exist',
      open: async (page) => {
        await page.goto('/invitations/no-such-invitation');
        await page.getByText('This invitation cannot be used').waitFor();
      },
    },
    {
      name: 'share link that opens nothing',
      open: async (page) => {
        await page.goto(`/shared/${'A'.repeat(65)}`);
        await page.getByText('This link opens nothing').waitFor();
      },
    },
    {
      name: 'page not found',
      open: async (page) => {
        await page.goto('/no/such/page');
        await page.getByText('No page here').waitFor();
      },
    },
  ],
  viewer: [
    workbenchBalanced,
    account,
    teamDerivedValues,
    notes,
    members,
    sets,
    {
      name: 'admin page, not allowed',
      open: async (page) => {
        await page.goto('/admin/users');
        await page.getByTestId('forbidden-view').waitFor();
      },
    },
  ],
  member: [
    workbenchBalanced,
    account,
    notes,
    noteComposer,
    members,
    deriveGiven,
    teamDerivedValues,
    amendmentQueue,
    newAmendment,
    newAmendmentKinds,
    importReport,
    proposeFromSpecies,
    sets,
    calorimetry,
    calorimetryBomb,
  ],
  teamAdmin: [workbenchBalanced, notes, members, sets],
  curator: [workbenchBalanced, account, notes, members, consistency, amendmentQueue, amendmentPage],
  siteAdmin: [
    workbenchBalanced,
    account,
    adminPage('/admin/users', 'admin users', (page) =>
      page.getByTestId('admin-users-table').locator('tbody tr').first().waitFor(),
    ),
    adminPage('/admin/teams', 'admin teams', (page) =>
      page.getByRole('cell', { name: 'Kestrel Bay Process Lab' }).waitFor(),
    ),
    adminPage('/admin/outbox', 'admin outbox', (page) => page.getByText('Messages').waitFor()),
    adminPage('/admin/audit-log', 'audit log', (page) => page.locator('tbody tr td').first().waitFor()),
  ],
  otherTeamAdmin: [notes, members],
};

for (const theme of ['light', 'dark'] as const) {
  describe(`accessibility (axe), ${theme} theme`, () => {
    // The app follows the system's colour scheme until the user picks a theme.
    const browser = useBrowser({ colorScheme: theme });

    for (const [role, steps] of Object.entries(walks) as Array<[Role | 'anonymous', Step[]]>) {
      it(`has no critical or serious violations on the pages of: ${role}`, async () => {
        const { page } = browser;
        if (role !== 'anonymous') await signIn(page, role);
        const findings: AxeFinding[] = [];
        for (const step of steps) {
          await step.open(page);
          findings.push(...(await axeFindings(page, `${step.name} [${role}, ${theme}]`)));
        }
        logSummary(`${role}, ${theme}`, findings);
        expect(blocking(findings)).toEqual([]);
      }, 240_000);
    }
  });
}
