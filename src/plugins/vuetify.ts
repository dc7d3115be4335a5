/** Vuetify with Trestle's own palette; Roboto and the icon font are bundled, nothing is fetched. */
import '@fontsource/roboto/300.css';
import '@fontsource/roboto/400.css';
import '@fontsource/roboto/500.css';
import '@fontsource/roboto/700.css';
import '@mdi/font/css/materialdesignicons.css';
import 'vuetify/styles';
import '../styles/drawings-dark.css';
import { createVuetify, type ThemeDefinition } from 'vuetify';
import { aliases, mdi } from 'vuetify/iconsets/mdi';

/** Trestle light: deep slate-teal for structure, ochre for action, rust and moss for status. */
export const trestleLight: ThemeDefinition = {
  dark: false,
  colors: {
    primary: '#23515E',
    secondary: '#B8742A',
    accent: '#D9A441',
    background: '#F3F2EE',
    surface: '#FFFFFF',
    'surface-variant': '#2B3A40',
    'on-surface-variant': '#EDEDE8',
    error: '#B3261E',
    warning: '#8F5512',
    info: '#2F6F8A',
    success: '#3E7B4F',
  },
};

/** Trestle dark: the same hues lifted for a dark ground (primary lighter so text and borders read). */
export const trestleDark: ThemeDefinition = {
  dark: true,
  colors: {
    primary: '#7FB8C6',
    'on-primary': '#0F2328',
    secondary: '#D9A15A',
    accent: '#E3B766',
    background: '#161B1D',
    surface: '#1F2628',
    'surface-variant': '#243236',
    'on-surface-variant': '#E3E7E4',
    error: '#F08A80',
    warning: '#E0A458',
    info: '#7DB7D1',
    success: '#83C195',
  },
};

/** Theme names (stored per user by src/composables/themeChoice.ts). */
export const THEME_NAMES = { light: 'trestleLight', dark: 'trestleDark' } as const;

export const vuetify = createVuetify({
  theme: { defaultTheme: THEME_NAMES.light, themes: { trestleLight, trestleDark } },
  icons: { defaultSet: 'mdi', aliases, sets: { mdi } },
  defaults: {
    VTextField: { variant: 'outlined', density: 'comfortable' },
    VTextarea: { variant: 'outlined', density: 'comfortable' },
    VSelect: { variant: 'outlined', density: 'comfortable' },
    VBtn: { rounded: 'md' },
    VCard: { rounded: 'lg' },
  },
});
