import type { SourceRow } from './sources-base';

/**
 * Located documents for coppers, copper alloys and precious-metal alloys: ids 100–199. Each was read
 * at the address given (pages marked "stored copy read at http://" were read over plain http; the
 * https address is the same page). Producer and distributor pages are cited only where they name
 * the standard the alloy is made to, and most of them reprint the Copper Development Association's
 * typical values.
 */
export const copperSources: SourceRow[] = [
  {
    id: 100,
    citation:
      'Copper Development Association, copper and copper alloy database (alloys.copper.org): typical physical properties of each alloy',
    kind: 'handbook',
    locator:
      'page of each alloy (alloys.copper.org/alloy/<UNS>), table "Physical Properties": density lb/cu in. at 68 °F, electrical conductivity %IACS at 68 °F',
    url: 'https://alloys.copper.org/',
  },
  {
    id: 101,
    citation:
      'Copper Development Association, Innovations, August 2001: "Introduction to Copper: Fact Sheets" (V. Callcut), Table 5, Physical Properties of Copper',
    kind: 'handbook',
    locator:
      'Table 5: density (IEC standard value of 1913; typical value at 20 °C) and electrical conductivity of annealed copper at 20 °C',
    url: 'https://copper.org/publications/newsletters/innovations/2001/08/intro_fac.php',
  },
  {
    id: 102,
    citation:
      'Metal Mart, "Copper Alloys" reference guide: property table of Olin Brass strip alloys with the ASTM specification of each (B152, B747, B465, B36, B121, B591)',
    kind: 'handbook',
    locator:
      'table rows "OLIN Alloy No.", "ASTM Spec. No.", "Density" (lb/in³) and "Elect. Cond." (%IACS), one column per alloy',
    url: 'https://metalmart.com/tools/miscellaneous-guides/copper-alloys-2',
  },
  {
    id: 103,
    citation:
      'Brass Copper Castings (India), copper alloy data pages reprinting CDA typical properties, each page naming the alloy’s ASTM specification',
    kind: 'handbook',
    locator:
      'page of each alloy, "Physical Properties": density lb/cu in @ 68 F, electrical conductivity % IACS @ 68 F (volume basis); some pages stored as copies read at http://brass-copper-castings.com/',
    url: 'https://www.brass-copper-castings.com/casting-alloys-copper-bronze-brass/',
  },
  {
    id: 104,
    citation:
      'Weldaloy Products, copper alloy material-property pages reproducing Copper Development Association data sheets (by permission of the CDA)',
    kind: 'handbook',
    locator:
      'page of each alloy: "Physical Properties" (US customary and metric) and the note on minimum conductivity of the high-conductivity coppers',
    url: 'https://weldaloy.com/material-property/',
  },
  {
    id: 105,
    citation:
      'Hussey Copper, alloy data sheets for copper-nickel C70600 and C71500, with the nearest applicable ASTM specifications (B111, B122, B466)',
    kind: 'handbook',
    locator:
      '"Physical Properties": density, electrical resistivity and conductivity (annealed) at 68 °F / 20 °C; stored copies read at http://www.husseycopper.com/production/alloys/non-electrical/',
    url: 'https://www.husseycopper.com/production/alloys/non-electrical/',
  },
  {
    id: 106,
    citation:
      'Wieland-Werke, data sheet "Wieland-M36 Rolled Products" (EN CuZn36, UNS C27000), public copy',
    kind: 'handbook',
    locator:
      '"Physical Properties" (reference values at room temperature; coefficient of electrical resistance between 0 and 300 °C)',
    url: 'https://deploy.doczz.net/doc/6621093/wieland-m36-rolled-products',
  },
  {
    id: 107,
    citation:
      'KME Germany, data sheet "CuZn40 C28000 Industrial Rolled" (edition 01/2019; mechanical properties per EN 1652), public copy',
    kind: 'handbook',
    locator:
      'page 1, "Physical Properties, typical values in annealed temper at 20 °C": thermal coefficient of electrical resistance (0 .. 100 °C)',
    url: 'https://www.scribd.com/document/475409512/CuZn40-01-2019-pdf',
  },
  {
    id: 108,
    citation:
      'KME Germany, data sheet "CuZn39Pb2 C37700 KME 339 Industrial Rolled" (mechanical properties per EN 1652), public copy',
    kind: 'handbook',
    locator:
      'page 1, "Physical Properties, typical values in annealed temper at 20 °C": density, electrical conductivity, thermal coefficient of electrical resistance (0 .. 100 °C)',
    url: 'https://studylib.net/doc/18375379/folie-1',
  },
  {
    id: 109,
    citation:
      'Krishna Metal Works, data sheet "KMW-CuSn 8" (CuSn8, CW453K, UNS C52100; mechanical properties per EN 1652)',
    kind: 'handbook',
    locator:
      '"Physical Properties, typical values in annealed temper at 20 °C": electrical conductivity (IACS, printed as a minimum, ">=11 %"), thermal coefficient of electrical resistance (0 .. 200 °C)',
    url: 'https://kmwindia.com/kmw-cusn8.html',
  },
  {
    id: 110,
    citation:
      'Concast Metal Products, alloy page C52100 (phosphor bronze 8 % C), composition and properties per ASTM B139/B139M-12(2017)',
    kind: 'handbook',
    locator: '"Machinability" table: density (lb/cu in at 68 °F)',
    url: 'https://www.concast.com/c52100.php',
  },
  {
    id: 111,
    citation:
      'Conex Casting, copper casting alloy pages: composition per ASTM B505/B505M-18, physical properties as provided by the Copper Development Association',
    kind: 'handbook',
    locator: 'page of each alloy, "Physical Properties" (provided by CDA), US customary and metric',
    url: 'https://conex-casting.com/',
  },
  {
    id: 112,
    citation:
      'Bronze Bearings Inc., alloy page C93200 (leaded tin bronze): composition per ASTM B505-08 and CDA physical properties',
    kind: 'handbook',
    locator:
      '"Physical Properties" (US customary and metric): density and electrical resistivity at 20 °C; stored copy read at http://www.bronzebearingsinc.com/alloy-c93200/',
    url: 'https://www.bronzebearingsinc.com/alloy-c93200/',
  },
  {
    id: 113,
    citation:
      'Olin Brass, "Alloy Data Specifications" pages of its strip alloys, each naming the ASTM specification (e.g. "C77000 (ASTM B122) Alloy Data Specifications")',
    kind: 'handbook',
    locator:
      'page of each alloy (olinbrass.com/resources/alloy-data-specifications/<alloy>), table "Physical Properties" (English and metric units): density, electrical resistivity, electrical conductivity (annealed); stored copy read at http://olinbrass.com/resources/alloy-data-specifications/',
    url: 'https://olinbrass.com/resources/alloy-data-specifications/',
  },
  {
    id: 114,
    citation:
      'ESPI Metals, technical data sheet "Silver - Sterling" (Ag 92.5 / Cu 7.5): typical properties',
    kind: 'handbook',
    locator:
      '"Typical Properties": composition in percent, density (g/cm³), electrical conductivity (IACS); a producer\'s typical values, no standard named (the sheet gives the composition)',
    url: 'https://espimetals.com/index.php/technical-data/81-Silver%20-%20Sterling',
  },
  {
    id: 115,
    citation:
      'Little Falls Alloys, "Beryllium Copper C17200 Tempered, 25 Alloy" wire data page (composition and physical properties of C17200, heat-treated condition)',
    kind: 'handbook',
    locator:
      'table "Physical Properties Beryllium Copper C17200, heat treated condition": specific gravity, electrical resistivity (ohms-circ mil/ft at 68 °F)',
    url: 'https://www.lfa-wire.com/tempered-alloy-25_c17200.htm',
  },
];
