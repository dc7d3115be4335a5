/** Vuetify with Trestle's own palette; Roboto and the icon font are bundled, nothing is fetched. */
import '@fontsource/roboto/300.css';
import '@fontsource/roboto/400.css';
import '@fontsource/roboto/500.css';
import '@fontsource/roboto/700.css';
import '@mdi/font/css/materialdesignicons.css';
import 'vuetify/styles';
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

export const vuetify = createVuetify({
  theme: { defaultTheme: 'trestleLight', themes: { trestleLight } },
  icons: { defaultSet: 'mdi', aliases, sets: { mdi } },
  defaults: {
    VTextField: { variant: 'outlined', density: 'comfortable' },
    VTextarea: { variant: 'outlined', density: 'comfortable' },
    VSelect: { variant: 'outlined', density: 'comfortable' },
    VBtn: { rounded: 'md' },
    VCard: { rounded: 'lg' },
  },
});
