/**
 * The citations behind the reference table. `kind: 'from_memory'` marks a citation that names
 * where a value is normally found but was not re-checked against that page for this table: the UI
 * shows those values with a "from memory" flag until a curator confirms them.
 */
export interface SourceRow {
  id: number;
  citation: string;
  kind: 'handbook' | 'standard' | 'paper' | 'measurement_set' | 'from_memory';
  locator: string | null;
  url: string | null;
}

/** The table's first citations; new located documents go to sources-copper.ts and sources-general.ts. */
export const baseSources: SourceRow[] = [
  {
    id: 1,
    citation:
      'IEC 60028, International standard of resistance for copper (the IACS of 1913; NBS Circular 31, 1914); restated in ASTM E1004',
    kind: 'standard',
    locator: '100 %IACS = 58.0 MS/m = 1.7241 µΩ·cm at 20 °C; α20 = 0.00393 /K for annealed copper',
    url: null,
  },
  {
    id: 2,
    citation:
      'Copper Development Association, Copper design guide: alloy designation and chemical composition, C26000',
    kind: 'handbook',
    locator: 'C26000: electrical conductivity 28 % IACS at 68 °F',
    url: 'https://copper.org/applications/industrial/DesignGuide/props/designations.php',
  },
  {
    id: 5,
    citation:
      'CRC Handbook of Chemistry and Physics, 97th ed. (2016), section 4, "Physical constants of inorganic compounds": densities of the elements (recalled, not re-checked)',
    kind: 'from_memory',
    locator: 'density at 20 °C',
    url: null,
  },
  {
    id: 6,
    citation:
      'ASM Handbook, Vol. 2 (1990), Properties and Selection: Nonferrous Alloys and Special-Purpose Materials; wrought and cast copper alloys (recalled, not re-checked)',
    kind: 'from_memory',
    locator: 'alloy data sheets, physical properties',
    url: null,
  },
  {
    id: 7,
    citation:
      'ASM Handbook, Vol. 2 (1990), Properties and Selection: Nonferrous Alloys; aluminium, zinc, nickel, titanium and magnesium alloys (recalled, not re-checked)',
    kind: 'from_memory',
    locator: 'alloy data sheets, physical properties',
    url: null,
  },
  {
    id: 8,
    citation:
      'ASM Handbook, Vol. 1 (1990), Properties and Selection: Irons, Steels, and High-Performance Alloys; carbon and stainless steels (recalled, not re-checked)',
    kind: 'from_memory',
    locator: 'physical properties of carbon and stainless steels',
    url: null,
  },
  {
    id: 11,
    citation:
      'Coinage alloy figures as commonly quoted by strip suppliers (recalled; no handbook table located)',
    kind: 'from_memory',
    locator: null,
    url: null,
  },
  {
    id: 12,
    citation:
      'Relative permeability of soft magnetic metals at low field, typical ranges (recalled; strongly dependent on field, temper and history)',
    kind: 'from_memory',
    locator: null,
    url: null,
  },
];
