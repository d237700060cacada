import type { SourceRow } from './sources-base';

/**
 * Located documents for pure metals, aluminium, zinc, nickel, iron and steel, the rest: ids 200–299.
 * Each row is one document as read at its `url` (a stored public copy). Where the copy is a
 * reproduction of another body's table (a die caster reprinting NADCA's table, a Scribd upload of
 * an ASM data sheet, a mirror of a Wikipedia infobox), the citation says so and names the origin
 * only as far as the page itself does.
 */
export const generalSources: SourceRow[] = [
  // Pure metals
  {
    id: 200,
    citation:
      'International Zinc Association, "Zinc Properties" (zinc basics: general, physical and miscellaneous properties of the element)',
    kind: 'handbook',
    locator:
      'Physical Properties (density near r.t.); Miscellaneous (electrical resistivity at 20 °C)',
    url: 'https://www.zinc.org/basics/zinc_properties',
  },
  {
    id: 201,
    citation: 'Wikipedia, article "Platinum", element infobox (read via the Wikiwand mirror)',
    kind: 'handbook',
    locator:
      'infobox: Physical properties (density near r.t.); Other properties (electrical resistivity at 20 °C)',
    url: 'https://www.wikiwand.com/en/Platinum',
  },
  {
    id: 202,
    citation:
      'R. A. Matula, "Electrical resistivity of copper, gold, palladium, and silver", J. Phys. Chem. Ref. Data 8, 1147 (1979), Table 5 (gold), as transcribed in the data of the Wikimedia Commons file "Resistivity Cu-Ag-Au.svg"',
    kind: 'paper',
    locator:
      'Table 5, recommended resistivity of gold, row T = 293 K (file description, Python data block T_rho_Au)',
    url: 'https://w.fbin.in/commons/lb/wiki/File:Resistivity%20Cu-Ag-Au.svg',
  },
  {
    id: 203,
    citation: 'WebElements (M. Winter, University of Sheffield), "Gold: physical properties"',
    kind: 'handbook',
    locator: 'Density properties (density of solid); Electrical properties',
    url: 'https://webelements.com/gold/physics.html',
  },
  {
    id: 204,
    citation:
      'Wikipedia, "Template:Infobox tantalum" (element infobox; read via the Wikihussain mirror)',
    kind: 'handbook',
    locator:
      'Physical properties (density near r.t.); Other properties (electrical resistivity at 20 °C)',
    url: 'https://en.wikihussain.com/view/Template:Infobox_tantalum',
  },
  {
    id: 205,
    citation: 'Wikipedia, "Template:Infobox iron" (element infobox; read via a public mirror)',
    kind: 'handbook',
    locator:
      'Physical properties (density near r.t.); Other properties (electrical resistivity at 20 °C)',
    url: 'https://readerswhoknow.paneidoverse.com/wiki/Template:Infobox_iron',
  },
  {
    id: 206,
    citation:
      'MatMake, "Properties of Lead (Pb)", table at room temperature (the page cites Cardarelli, Materials Handbook, Springer 2018; CRC Handbook of Chemistry and Physics, 97th ed.; Howatson et al., Engineering Tables and Data, Oxford 2009)',
    kind: 'handbook',
    locator: 'Table of Lead Properties: Physical Properties (density); Electrical Properties',
    url: 'https://matmake.com/materials-data/lead-properties.html',
  },
  {
    id: 207,
    citation: 'Wikipedia (Scots edition), article "Titanium", element infobox',
    kind: 'handbook',
    locator:
      'infobox: Pheesical properties (density near r.t.); Ither properties (electrical resistivity at 20 °C)',
    url: 'https://sco.wikipedia.org/wiki/Titanium',
  },
  {
    id: 208,
    citation:
      'ASM International, Alloying: Understanding the Basics (J. R. Davis, ed., 2001), article "Magnesium and Magnesium Alloys", p. 432 (abstract on the ASM materials-resources site)',
    kind: 'handbook',
    locator: 'article abstract: density of magnesium and electrical conductivity of magnesium',
    url: 'https://www.asminternational.org/materials-resources/results/-/journal_content/56/10192/AUTB2001P432/BOOK-ARTICLE',
  },
  {
    id: 209,
    citation:
      'MatMake, "Properties of Tungsten (W)", table at room temperature (the page cites Cardarelli, Materials Handbook; CRC Handbook of Chemistry and Physics, 97th ed.; Howatson et al., Engineering Tables and Data)',
    kind: 'handbook',
    locator: 'Physical Properties (density); Electrical Properties (electrical resistivity)',
    url: 'https://matmake.com/materials-data/tungsten-properties.html',
  },
  {
    id: 210,
    citation:
      'Midwest Tungsten Service, "Tungsten" material data (producer property table for the element)',
    kind: 'handbook',
    locator: 'property table: temperature coefficient of electrical resistivity per °C (0–100 °C)',
    url: 'https://www.tungsten.com/materials/tungsten/',
  },
  {
    id: 211,
    citation:
      'The Prep Room info library (UK school science technicians), Electricity > "Electrical Resistivity": table of resistivity at 20 °C and temperature coefficient of common materials',
    kind: 'handbook',
    locator: 'table "Resistivity (Ωm) at 20 °C / Temperature coefficient [K−1]"',
    url: 'https://www.preproom.org/info-library/default.aspx?t1=4&t2=22&t3=0&t4=0',
  },
  {
    id: 212,
    citation:
      'K. C. Agrawal, Industrial Power Engineering and Applications Handbook (Newnes, 2001), table of properties of standard copper and commercial-purity aluminium for electrical use, p. 970',
    kind: 'handbook',
    locator:
      'p. 970: volume conductivity, %IACS and temperature coefficient of resistance at 20 °C',
    url: 'https://digilib.universitaspertamina.ac.id/ebook/Industrial%20Power%20Engineering%20and%20Applications%20Handbook/files/basic-html/page970.html',
  },
  {
    id: 213,
    citation:
      'MatMake, "Properties of Zirconium (Zr)", table at room temperature (the page cites Cardarelli, Materials Handbook; CRC Handbook of Chemistry and Physics, 97th ed.; Howatson et al., Engineering Tables and Data)',
    kind: 'handbook',
    locator: 'Physical Properties (density); Electrical Properties (electrical resistivity)',
    url: 'https://matmake.com/materials-data/zirconium-properties.html',
  },
  {
    id: 214,
    citation:
      'Materials Handbook (Brady, Clauser and Vaccari, McGraw-Hill), entry "Nickel", as excerpted in the post "nickel element" (nickelore.blogspot.com, 2010)',
    kind: 'handbook',
    locator: 'entry NICKEL: specific gravity and electrical conductivity relative to copper',
    url: 'https://nickelore.blogspot.com/2010/08/nickel-element.html',
  },
  // Aluminium
  {
    id: 215,
    citation:
      'MatMake, "Electrical Conductivity of Common Aluminum Alloys" (table of %IACS by alloy and temper at about 20 °C; the page names no source)',
    kind: 'handbook',
    locator: 'table of alloys and tempers, %IACS column',
    url: 'https://matmake.com/properties/electrical-conductivity-of-aluminum-alloys.html',
  },
  {
    id: 216,
    citation:
      '"Physical Properties of Aluminium Alloys": table of typical density, %IACS and resistivity at 68 °F of wrought alloys, published by tubingchina.com (its column set and footnotes follow the Aluminum Association\'s typical-properties table; the page does not name its source)',
    kind: 'handbook',
    locator:
      'table rows 1100, 1350, 2024-T3/T4, 5052, 6061-T6: density (lb/in³), electrical conductivity equal volume (%IACS) at 68 °F',
    url: 'https://tubingchina.com/Physical-Properties-of-Aluminium-Alloys.htm',
  },
  {
    id: 217,
    citation:
      'ASTM B233, Standard Specification for Aluminum 1350 Drawing Stock for Electrical Purposes (resistivity table as shown on the BSB Edge standard page)',
    kind: 'standard',
    locator:
      'table of maximum resistivity / equivalent volume conductivity by temper, and table of resistivity constants',
    url: 'https://bsbedge.com/standard/standard-specification-for-aluminum-1350-drawing-stock-for-electrical-purposes/ASTM081847',
  },
  {
    id: 218,
    citation:
      'ASM Aerospace Specification Metals / MatWeb, material data sheet "Aluminum 5083-H32; 5083-H323" (values marked AA from the Aluminum Association)',
    kind: 'handbook',
    locator:
      'Physical Properties (density, AA typical); Electrical Properties (electrical resistivity)',
    url: 'https://asm.matweb.com/search/SpecificMaterial.asp?bassnum=MA5083H32',
  },
  {
    id: 219,
    citation:
      'ASM Aerospace Specification Metals / MatWeb, material data sheet "Aluminum 6063-T6" (values marked AA from the Aluminum Association)',
    kind: 'handbook',
    locator:
      'Physical Properties (density, AA typical); Electrical Properties (electrical resistivity, AA typical at 68 °F)',
    url: 'https://asm.matweb.com/search/SpecificMaterial.asp?bassnum=MA6063T6',
  },
  {
    id: 220,
    citation:
      'MatWeb, data sheet "Aluminum 7075-T6; 7075-T651" (print version; values marked AA from the Aluminum Association)',
    kind: 'handbook',
    locator: 'Physical Properties: density (AA; Typical)',
    url: 'https://www.matweb.com/search/datasheet_print.aspx?matguid=4f19a42be94546b686bbf43f79c51b7d',
  },
  {
    id: 221,
    citation:
      'Wikipedia, article "7075 aluminium alloy", infobox A7075 T6 (read via a Kiwix mirror)',
    kind: 'handbook',
    locator: 'infobox: Electrical properties (volume resistivity)',
    url: 'https://wiki.av1.space/content/wikipedia_en_all_mini_2025-06/7075_aluminium_alloy',
  },
  {
    id: 222,
    citation:
      'North American Die Casting Association, NADCA Alloy Data A-3-2-12, Table A-3-2 "Typical Material Properties: Al Alloys" (one-page standard; Scribd upload)',
    kind: 'standard',
    locator: 'Physical Properties: density (lb/in³ and g/cm³) by alloy column',
    url: 'https://www.scribd.com/document/515469800/MECHANICAL-AND-PHYSICAL-PROPERTIE-OF-THE-ALLOY',
  },
  {
    id: 223,
    citation:
      'MatWeb data for "Aluminum A380.0-F Die Casting Alloy" (UNS A13800) as reproduced by a die caster (diecasting.com.vn, "A380 Aluminum Alloy, Common die casting Alloy")',
    kind: 'handbook',
    locator: 'Electrical Properties: electrical resistivity',
    url: 'https://diecasting.com.vn/a380-aluminum-alloy-common-die-casting-alloy.html',
  },
  {
    id: 224,
    citation: 'MakeItFrom.com, "A360.0-F Cast Aluminum" material properties',
    kind: 'handbook',
    locator: 'Electrical Properties: electrical conductivity, equal volume',
    url: 'https://makeitfrom.com/material-properties/A360.0-F-Cast-Aluminum',
  },
  {
    id: 225,
    citation:
      'MatWeb, data sheet "Aluminum A356.0-T6, Sand Cast" (print version; values marked AA from the Aluminum Association)',
    kind: 'handbook',
    locator: 'Physical Properties (density); Electrical Properties (electrical resistivity)',
    url: 'https://matweb.com/search/datasheet_print.aspx?matguid=d524d6bf305c4ce99414cabd1c7ed070',
  },
  {
    id: 226,
    citation:
      'Aalco Metals Ltd, data sheet "Aluminium Alloy 6082" (stockholder sheet drawn from the EN specifications; Scribd upload)',
    kind: 'handbook',
    locator: 'Physical Properties table: density, electrical resistivity',
    url: 'https://www.scribd.com/doc/88698498/Al-6082',
  },
  {
    id: 227,
    citation:
      'SubsTech (Substances & Technologies, D. Kopeliovich), "Wrought aluminum-copper alloy 2011" property table',
    kind: 'handbook',
    locator: 'property table: density, electric resistivity',
    url: 'https://www.substech.com/dokuwiki/doku.php?id=wrought_aluminum-copper_alloy_2011',
  },
  // Zinc
  {
    id: 228,
    citation:
      '"Zinc Properties": the NADCA composition-and-properties table of zinc die-casting alloys (No. 3, No. 5, No. 7, ZA-8, ZA-12, ZA-27) as reproduced by a die caster (imfggrp.com)',
    kind: 'handbook',
    locator:
      'rows "Density (lb./in.3)" and "Electrical conductivity (% IACS)", one column per alloy',
    url: 'https://imfggrp.com/die-casting/materials/zinc-properties.html',
  },
  {
    id: 229,
    citation:
      'Siegfried Müller die casting, table "Zinc alloy according to EN12844" (ZP0400, ZP0410, ZP0430, ZP0810; physical properties at 20 °C, informative)',
    kind: 'handbook',
    locator:
      'Physical properties (at 20°C): density, electrical conductivity %IACS, electrical resistivity',
    url: 'https://siegfried-mueller.de/en/table/table-zinc-alloy-according-to-en12844.asp',
  },
  {
    id: 230,
    citation:
      'MakeItFrom.com, "Zinc-Low Copper-Titanium Rolled Zinc Alloy (Z41121)" material properties',
    kind: 'handbook',
    locator: 'Electrical Properties: electrical conductivity, equal volume',
    url: 'https://makeitfrom.com/material-properties/Zinc-Low-Copper-Titanium-Rolled-Zinc-Alloy-Z41121',
  },
  // Iron and steel
  {
    id: 231,
    citation:
      'ASM Aerospace Specification Metals / MatWeb, material data sheet "AISI Type 316 Stainless Steel, annealed bar"',
    kind: 'handbook',
    locator:
      'Physical Properties (density); Electrical Properties (electrical resistivity at 20 °C)',
    url: 'https://asm.matweb.com/search/SpecificMaterial.asp?bassnum=MQ316J',
  },
  {
    id: 232,
    citation:
      'ASM Material Data Sheet "AISI Type 304 Stainless Steel" (Scribd upload of the ASM/MatWeb sheet)',
    kind: 'handbook',
    locator:
      'Physical Properties (density); Electrical Properties (electrical resistivity at 20 °C)',
    url: 'https://www.scribd.com/document/416534641/304-Stainless-Steel-pdf',
  },
  {
    id: 233,
    citation:
      'Hamilton Precision Metals, "SS 430" strip and foil data (material conforms to ASTM A240; typical physical properties)',
    kind: 'handbook',
    locator:
      'SS 430 Physical Properties: density, electrical resistivity at R.T., magnetic permeability',
    url: 'https://www.hpmetals.com/products/materials/stainless-steel-strip-foil/ss-430',
  },
  {
    id: 234,
    citation:
      'ASM Aerospace Specification Metals / MatWeb, material data sheet "AISI Type 410 Stainless Steel, tempered at test temperature plus 28C, tested at 480C (900F)"',
    kind: 'handbook',
    locator:
      'Physical Properties (density); Electrical Properties (electrical resistivity at 20 °C, magnetic permeability annealed at RT)',
    url: 'https://asm.matweb.com/search/SpecificMaterial.asp?bassnum=MQ410AE',
  },
  {
    id: 235,
    citation: 'AZoM, "Grade 17-4 Stainless Steel (UNS S17400)" data article',
    kind: 'handbook',
    locator: 'Physical Properties table: density',
    url: 'https://azom.com/article.aspx?ArticleID=6778',
  },
  {
    id: 236,
    citation:
      '"SAE 1018 Steel Properties" (MatWeb data sheet for AISI 1018 as reproduced by steel-tube.com)',
    kind: 'handbook',
    locator:
      'Physical Properties (density); Electrical Properties (electrical resistivity, annealed, 0 °C and 100 °C)',
    url: 'https://steel-tube.com/news/html/494.html',
  },
  {
    id: 237,
    citation: '"SAE 1045 Steel Properties" (MatWeb data for AISI 1045 as reproduced by a179.net)',
    kind: 'handbook',
    locator:
      'Physical Properties (density); Electrical Properties (electrical resistivity, annealed, 0 °C and elevated temperature)',
    url: 'https://www.a179.net/2012/01/08/sae-1045-steel-properties/',
  },
  {
    id: 238,
    citation:
      'AZoM, "Comparison of Physical Properties of Cast Iron with Steel Castings" (table supplied by the foundry Fonderie Saguenay)',
    kind: 'handbook',
    locator: 'table, column Gray Iron: density (lbs/in³), electrical resistivity (µΩ·cm)',
    url: 'https://azom.com/article.aspx?ArticleID=5563',
  },
  // Titanium and magnesium
  {
    id: 239,
    citation:
      'Hamilton Precision Metals, "CP Titanium" strip and foil data (material conforms to ASTM F67, ASTM B265; typical physical properties)',
    kind: 'handbook',
    locator: 'CP Titanium Physical Properties: density, electrical resistivity at R.T.',
    url: 'https://www.hpmetals.com/products/materials/titanium-strip-foil/cp-titanium',
  },
  {
    id: 240,
    citation:
      'ASM Aerospace Specification Metals / MatWeb, material data sheet "Titanium Ti-6Al-4V (Grade 5), Annealed Bar"',
    kind: 'handbook',
    locator: 'Physical Properties (density); Electrical Properties (electrical resistivity)',
    url: 'https://asm.matweb.com/search/SpecificMaterial.asp?bassnum=MTP644',
  },
  {
    id: 241,
    citation:
      'SubsTech (Substances & Technologies, D. Kopeliovich), "Wrought magnesium alloy AZ31B" property table',
    kind: 'handbook',
    locator: 'property table: density, electric resistivity',
    url: 'https://www.substech.com/dokuwiki/doku.php?id=wrought_magnesium_alloy_az31b',
  },
  // Solders
  {
    id: 242,
    citation:
      'Alasir reference, "Solder Alloys": table of melting point, density and electrical resistivity of common solders (alloy numbers as in Indium Corporation\'s solder directory)',
    kind: 'handbook',
    locator:
      'table rows Sn63Pb37 (alloy #106), Sn60Pb40 (alloy #109), Sn96.5Ag3.0Cu0.5 (alloy #256, SAC305): density g/cm³, electrical resistivity µΩ·m',
    url: 'https://www.alasir.com/reference/solder_alloys/',
  },
  // Added late: silver density
  {
    id: 243,
    citation:
      'ThoughtCo (A. M. Helmenstine), "Silver Facts: Silver Chemical & Physical Properties" (element fact sheet; its references list the CRC Handbook of Chemistry & Physics and Lange\'s Handbook of Chemistry)',
    kind: 'handbook',
    locator: 'Properties paragraph: specific gravity at 20 °C',
    url: 'https://www.thoughtco.com/silver-facts-606596',
  },
  // Added: pure metals, nickel alloys, permeability, carbon steel, aluminium densities
  {
    id: 244,
    citation:
      'MatMake, "Properties of Cobalt (Co)", table at room temperature (the page cites Cardarelli, Materials Handbook, Springer 2018; CRC Handbook of Chemistry and Physics, 97th ed.; Howatson et al., Engineering Tables and Data, Oxford 2009)',
    kind: 'handbook',
    locator:
      'Table of Cobalt Properties: Physical Properties (density); Electrical Properties (electrical resistivity)',
    url: 'https://matmake.com/materials-data/cobalt-properties.html',
  },
  {
    id: 245,
    citation:
      'molybdenum.com, "Physical Properties" of molybdenum (producer\'s property-and-value table for solid molybdenum; the page names no standard)',
    kind: 'handbook',
    locator:
      'table "Molybdenum Property & Value": density at 20 °C, electrical resistivity at 20 °C; stored copy read at http://www.molybdenum.com/properties/molybdenum-physical/',
    url: 'https://www.molybdenum.com/properties/molybdenum-physical/',
  },
  {
    id: 246,
    citation: 'MatWeb, material data sheet "Tin, Sn" (pure element; white/beta tin)',
    kind: 'handbook',
    locator: 'Physical Properties: density, beta crystal structure row',
    url: 'https://matweb.com/search/DataSheet.aspx?MatGUID=64d7cf04332e428dbca9f755f4624a6c',
  },
  {
    id: 247,
    citation:
      'palladium-pd.org, palladium element fact page (its property table reproduces the Wikipedia element infobox)',
    kind: 'handbook',
    locator:
      'Physical properties: density (near r.t.); Miscellanea: electrical resistivity (20 °C); stored copy read at http://www.palladium-pd.org/',
    url: 'https://www.palladium-pd.org/',
  },
  {
    id: 248,
    citation:
      'Special Metals Corporation, data sheet "Nickel 200 & 201" (UNS N02200, N02201), Table 2 "Physical Constants" (Scribd upload, filed there under an unrelated title)',
    kind: 'handbook',
    locator:
      'Table 2, Nickel 200: electrical resistivity (ohm·circ mil/ft) against temperature (°F), row 70 °F',
    url: 'https://www.scribd.com/doc/228390267/J-Electrochem-Soc-1960-Seybolt-147-56',
  },
  {
    id: 249,
    citation:
      'Wikipedia, article "Permeability (electromagnetism)", section "Values for some common materials" (table of relative permeability; read via the LiquiSearch mirror)',
    kind: 'handbook',
    locator:
      'table column "Relative permeability μ/μ0" with field "at 0.002 T": rows Steel, Nickel',
    url: 'https://www.liquisearch.com/permeability_electromagnetism/values_for_some_common_materials',
  },
  {
    id: 250,
    citation:
      'Rolled Metal Products, "AISI 1008 Steel (UNS G10080)" data page (tempers per ASTM A109; typical physical properties)',
    kind: 'handbook',
    locator:
      'Physical Properties table: density (lb/in³), electrical resistivity (microohm-in); stored copy read at http://www.rolledmetalproducts.com/carbon-steel-1008/',
    url: 'https://www.rolledmetalproducts.com/carbon-steel-1008/',
  },
  {
    id: 251,
    citation:
      'Double Eagle Alloys, "Ni-Cu 400 (Monel®) (UNS N04400)" data page (composition and annealed mechanical requirements per ASTM B164; typical physical properties)',
    kind: 'handbook',
    locator: 'Physical Properties table: density (lb/in³), electrical resistivity (microhm-in)',
    url: 'https://doubleeaglealloys.com/products/corrosion-resistant-alloys/nickel-copper-monel-400/',
  },
  {
    id: 252,
    citation: 'Wikipedia, article "6005 aluminium alloy" (typical material properties)',
    kind: 'handbook',
    locator: 'section Properties: density',
    url: 'https://en.wikipedia.org/wiki/6005_aluminium_alloy',
  },
  {
    id: 253,
    citation: 'MatMake, "Aluminum Alloy 1060 (UNS A91060)" property table',
    kind: 'handbook',
    locator: 'Table of Aluminum 1060 Properties: Physical Properties (density)',
    url: 'https://matmake.com/materials-data/aluminum-1060-properties.html',
  },
  {
    id: 254,
    citation: 'MatMake, "Aluminum Alloy 3105 (UNS A93105)" property table',
    kind: 'handbook',
    locator: 'Physical Properties table: density',
    url: 'https://matmake.com/materials-data/aluminum-3105-properties.html',
  },
];
