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

export const trestleGridTheme = themeQuartz.withParams({
  accentColor: '#23515E',
  foregroundColor: '#1F2A2E',
  backgroundColor: '#FFFFFF',
  headerBackgroundColor: '#E9ECE7',
  headerTextColor: '#23414A',
  oddRowBackgroundColor: '#FAFAF7',
  rowHoverColor: '#EEF3F1',
  selectedRowBackgroundColor: '#DCE8E5',
  borderColor: '#D5D9D3',
  fontFamily: 'Roboto, sans-serif',
  fontSize: 13,
  headerFontSize: 13,
  headerFontWeight: 500,
  rowHeight: 32,
  headerHeight: 38,
  spacing: 6,
  wrapperBorderRadius: 8,
});
