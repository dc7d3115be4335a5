/** Shape of the catalogue data files. */
import type { SectionDims, SectionProps, ShapeKind } from '../../model/types.js';

export interface CatalogueEntry {
  /** canonical designation, e.g. "IPE300", "W12X26", "HSS6X6X3/8" */
  name: string;
  /** other accepted spellings (normalised the same way), e.g. "HE200A" */
  aliases?: string[];
  shape: ShapeKind;
  /** dimensions in the series' unit (mm or in); HSS wall = design thickness */
  dims: SectionDims;
  /** tabulated properties in the series' property units (cm… or in…), where recalled */
  tabulated?: Partial<SectionProps>;
}

export interface CatalogueSeries {
  series: string;
  /** where the dimensions (and any tabulated values) come from */
  source: string;
  /** unit of `dims`; tabulated properties use cm2/cm3/cm4/cm6 for mm series, in2… for in */
  unit: 'mm' | 'in';
  entries: CatalogueEntry[];
}
