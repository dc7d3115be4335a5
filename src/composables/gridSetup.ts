/**
 * ag-grid for Trestle: only the community modules our grids use, registered once, and a
 * theme built from our own palette (no CSS imports).
 */
import {
  CellStyleModule, ClientSideRowModelApiModule, ClientSideRowModelModule, ColumnApiModule, CustomEditorModule,
  ExternalFilterModule, ModuleRegistry, NumberFilterModule, QuickFilterModule, RenderApiModule, RowApiModule,
  RowStyleModule, ScrollApiModule, TextEditorModule, TextFilterModule, TooltipModule, themeQuartz,
} from 'ag-grid-community';

let registered = false;

export function registerGridModules(): void {
  if (registered) return;
  ModuleRegistry.registerModules([
    ClientSideRowModelModule, ClientSideRowModelApiModule, TextFilterModule, NumberFilterModule, QuickFilterModule,
    ExternalFilterModule, TextEditorModule, CustomEditorModule, CellStyleModule, RowStyleModule, ColumnApiModule,
    RowApiModule, RenderApiModule, ScrollApiModule, TooltipModule,
  ]);
  registered = true;
}

const shared = {
  fontFamily: 'Roboto, sans-serif',
  fontSize: 13,
  headerFontSize: 13,
  headerFontWeight: 500,
  rowHeight: 32,
  headerHeight: 38,
  spacing: 6,
  wrapperBorderRadius: 8,
};

/**
 * One theme with a light (default) and a dark mode: ag-grid picks the dark parameters while
 * `<html data-ag-theme-mode="dark">` is set, which src/composables/themeChoice.ts does with
 * Vuetify's theme, so every grid follows the app's theme without being re-created.
 */
export const trestleGridTheme = themeQuartz
  .withParams({
    ...shared,
    accentColor: '#23515E',
    foregroundColor: '#1F2A2E',
    backgroundColor: '#FFFFFF',
    headerBackgroundColor: '#E9ECE7',
    headerTextColor: '#23414A',
    oddRowBackgroundColor: '#FAFAF7',
    rowHoverColor: '#EEF3F1',
    selectedRowBackgroundColor: '#DCE8E5',
    borderColor: '#D5D9D3',
  })
  .withParams({
    ...shared,
    accentColor: '#7FB8C6',
    foregroundColor: '#E3E7E4',
    backgroundColor: '#1F2628',
    headerBackgroundColor: '#2A3336',
    headerTextColor: '#CFE0E4',
    oddRowBackgroundColor: '#232B2E',
    rowHoverColor: '#2D393D',
    selectedRowBackgroundColor: '#2F4A50',
    borderColor: '#3A4649',
    browserColorScheme: 'dark',
  }, 'dark');

/** Sets the grids' mode (light or dark) for the whole document. */
export function setGridThemeMode(dark: boolean): void {
  if (typeof document !== 'undefined') document.documentElement.dataset.agThemeMode = dark ? 'dark' : 'light';
}
