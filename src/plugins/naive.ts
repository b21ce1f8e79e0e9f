/**
 * naive-ui set-up in one place: the two themes' colours and type, and the meta tag that makes
 * naive-ui insert its styles before ours so our few global rules can override it.
 */
import type { GlobalThemeOverrides } from 'naive-ui';

const sans = "'IBM Plex Sans', system-ui, -apple-system, 'Segoe UI', sans-serif";
const mono = "'IBM Plex Mono', ui-monospace, 'SFMono-Regular', Menlo, monospace";

const shared: GlobalThemeOverrides['common'] = {
  fontFamily: sans,
  fontFamilyMono: mono,
  borderRadius: '6px',
  borderRadiusSmall: '4px',
  fontSize: '15px',
  fontSizeMedium: '15px',
};

// A field's hint or error gets room below it, so it does not run into the next field's label.
const form: GlobalThemeOverrides['Form'] = {
  feedbackPadding: '3px 0 6px 2px',
  feedbackHeightMedium: '30px',
  feedbackHeightSmall: '28px',
};

/** Warm paper with a deep teal accent. */
export const lightOverrides: GlobalThemeOverrides = {
  common: {
    ...shared,
    primaryColor: '#0f6b66',
    primaryColorHover: '#14807a',
    primaryColorPressed: '#0a514d',
    primaryColorSuppl: '#14807a',
    bodyColor: '#f6f3ec',
    cardColor: '#fffdf8',
    modalColor: '#fffdf8',
    popoverColor: '#fffdf8',
    tableColor: '#fffdf8',
    tableHeaderColor: '#f1ece1',
    textColorBase: '#1d2a2c',
    textColor1: '#1d2a2c',
    textColor2: '#33413f',
    textColor3: '#5f6b68',
    borderColor: '#e2dccf',
    dividerColor: '#e7e1d5',
    errorColor: '#b3261e',
    // Success and warning text sits on a 12 % tint of itself in tags: these shades keep 4.5:1 there (WCAG AA).
    warningColor: '#8f5600',
    warningColorHover: '#a56300',
    warningColorPressed: '#704300',
    warningColorSuppl: '#a56300',
    successColor: '#276b3a',
    successColorHover: '#2f7d45',
    successColorPressed: '#1d5029',
    successColorSuppl: '#2f7d45',
    infoColor: '#2c6a8f',
  },
  Layout: { headerColor: '#fffdf8', color: '#f6f3ec' },
  // naive-ui greys "nothing here" texts to the disabled colour, below 4.5:1; they are content, not disabled.
  Empty: { textColor: '#5f6b68' },
  Form: form,
};

/** Slate with a lighter teal accent. */
export const darkOverrides: GlobalThemeOverrides = {
  common: {
    ...shared,
    primaryColor: '#4dbdb2',
    primaryColorHover: '#66cdc3',
    primaryColorPressed: '#379d93',
    primaryColorSuppl: '#66cdc3',
    bodyColor: '#141a1f',
    cardColor: '#1b232a',
    modalColor: '#1e272f',
    popoverColor: '#1e272f',
    tableColor: '#1b232a',
    tableHeaderColor: '#212b33',
    borderColor: '#2f3b45',
    dividerColor: '#2a353e',
    errorColor: '#ef7b73',
    warningColor: '#e0a445',
    successColor: '#6cc58a',
    infoColor: '#7ab8de',
  },
  Layout: { headerColor: '#1b232a', color: '#141a1f' },
  Empty: { textColor: '#9aa7b0' },
  Form: form,
};

/** Adds the `naive-ui-style` marker so naive-ui's styles load before the app's own. */
export function installNaiveStyleOrder(doc: Document = document): void {
  if (doc.querySelector('meta[name="naive-ui-style"]')) return;
  const meta = doc.createElement('meta');
  meta.name = 'naive-ui-style';
  doc.head.appendChild(meta);
}
