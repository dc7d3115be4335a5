/** The light/dark choice per user in browser storage (pure: the storage is passed in). */
export type ThemeChoice = 'light' | 'dark';

/** The storage key of a user's choice. */
export function themeKey(userId: number): string {
  return `trestle.theme.${userId}`;
}

export interface KeyValueStore {
  getItem(key: string): string | null;
  setItem(key: string, value: string): void;
}

/** The stored choice of a user ('light' when none, unreadable or signed out). */
export function storedTheme(storage: KeyValueStore | null, userId: number | null | undefined): ThemeChoice {
  if (!storage || userId === null || userId === undefined) return 'light';
  try {
    return storage.getItem(themeKey(userId)) === 'dark' ? 'dark' : 'light';
  } catch {
    return 'light';
  }
}

/** Stores a user's choice (ignored when storage is unavailable). */
export function storeTheme(storage: KeyValueStore | null, userId: number, choice: ThemeChoice): void {
  try {
    storage?.setItem(themeKey(userId), choice);
  } catch {
    // private mode or full: the choice lasts this session only
  }
}

