/**
 * The light/dark theme choice, remembered per user in this browser (localStorage, keyed by the
 * user's id), applied to Vuetify and to every ag-grid (gridSetup's dark mode).
 */
import { computed, watch } from 'vue';
import { useTheme } from 'vuetify';
import { THEME_NAMES } from '../plugins/vuetify.js';
import { useAuthStore } from '../stores/auth.js';
import { setGridThemeMode } from './gridSetup.js';
import { storedTheme, storeTheme, type ThemeChoice, type KeyValueStore } from '../utils/themeStorage.js';

function browserStorage(): KeyValueStore | null {
  try {
    return typeof localStorage === 'undefined' ? null : localStorage;
  } catch {
    return null;
  }
}

/** Call once in a component inside the app (the app bar): follows the signed-in user's choice. */
export function useThemeChoice() {
  const theme = useTheme();
  const auth = useAuthStore();
  const isDark = computed(() => theme.global.name.value === THEME_NAMES.dark);

  function apply(choice: ThemeChoice): void {
    void theme.change(THEME_NAMES[choice]);
    setGridThemeMode(choice === 'dark');
  }

  watch(() => auth.user?.id, (id) => apply(storedTheme(browserStorage(), id)), { immediate: true });

  function toggle(): void {
    const next: ThemeChoice = isDark.value ? 'light' : 'dark';
    apply(next);
    if (auth.user) storeTheme(browserStorage(), auth.user.id, next);
  }

  return { isDark, toggle };
}
