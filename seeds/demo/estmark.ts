/**
 * The demo scenario, all invented (product.md): no real mint, recycler, coin or measurement.
 * Estmark's coins are struck at the Carrow Bay Mint; Ridgeline Metals Recovery runs a mixed
 * non-ferrous line. Sizes and readings below were made up to be plausible, not measured.
 */
export interface DemoLayer {
  alloy: string;
  thicknessM: number;
}

export interface DemoStack {
  slug: string;
  name: string;
  description: string;
  diameterM: number;
  /** From the face toward the coil downward, through the whole blank. */
  layers: DemoLayer[];
}

const um = 1e-6;
const mm = 1e-3;

export const demoStacks: DemoStack[] = [
  {
    slug: 'estmark-1-mark',
    name: 'Estmark 1 mark',
    description: 'Copper-plated zinc core, 8 µm copper on each face (invented).',
    diameterM: 19.0 * mm,
    layers: [
      { alloy: 'copper-c11000', thicknessM: 8 * um },
      { alloy: 'zinc-coinage-strip', thicknessM: 1.34 * mm },
      { alloy: 'copper-c11000', thicknessM: 8 * um },
    ],
  },
  {
    slug: 'estmark-2-marks',
    name: 'Estmark 2 marks',
    description: 'Copper-plated low-carbon steel, 25 µm copper on each face; magnetic (invented).',
    diameterM: 21.0 * mm,
    layers: [
      { alloy: 'copper-c11000', thicknessM: 25 * um },
      { alloy: 'steel-1008', thicknessM: 1.6 * mm },
      { alloy: 'copper-c11000', thicknessM: 25 * um },
    ],
  },
  {
    slug: 'estmark-5-marks',
    name: 'Estmark 5 marks',
    description: 'Solid gilding metal 95/5 (invented).',
    diameterM: 23.0 * mm,
    layers: [{ alloy: 'gilding-metal-c21000', thicknessM: 1.75 * mm }],
  },
  {
    slug: 'estmark-10-marks',
    name: 'Estmark 10 marks',
    description:
      'Cupronickel 75/25 clad on a copper core, each cladding one sixth of the thickness (invented).',
    diameterM: 24.5 * mm,
    layers: [
      { alloy: 'cupronickel-75-25-c71300', thicknessM: 0.32 * mm },
      { alloy: 'copper-c11000', thicknessM: 1.31 * mm },
      { alloy: 'cupronickel-75-25-c71300', thicknessM: 0.32 * mm },
    ],
  },
  {
    slug: 'estmark-20-marks',
    name: 'Estmark 20 marks',
    description: 'Solid nickel brass (invented).',
    diameterM: 26.5 * mm,
    layers: [{ alloy: 'nickel-brass-coinage', thicknessM: 2.0 * mm }],
  },
  {
    slug: 'estmark-1-mark-solid',
    name: 'Estmark 1 mark, first issue',
    description:
      'Solid gilding metal 95/5, the size of the plated 1 mark that replaced it; both still circulate (invented).',
    diameterM: 19.0 * mm,
    layers: [{ alloy: 'gilding-metal-c21000', thicknessM: 1.356 * mm }],
  },
];

export interface DemoReading {
  label: string;
  site: string;
  product: string;
  conductivitySPerM: number;
  frequencyHz: number;
  temperatureK: number;
  densityKgPerM3: number | null;
  massKg: number | null;
}

const iacs = (percent: number) => percent * 0.58e6;
const celsius = (c: number) => c + 273.15;
const ridgeline = 'Ridgeline Metals Recovery, mixed non-ferrous line';

export const demoReadings: DemoReading[] = [
  {
    label: 'R-101',
    site: ridgeline,
    product: 'Shredded aluminium profile',
    conductivitySPerM: iacs(52.1),
    frequencyHz: 60e3,
    temperatureK: celsius(27),
    densityKgPerM3: 2700,
    massKg: 0.0182,
  },
  {
    label: 'R-102',
    site: ridgeline,
    product: 'Brass fitting',
    conductivitySPerM: iacs(25.6),
    frequencyHz: 60e3,
    temperatureK: celsius(27),
    densityKgPerM3: 8490,
    massKg: 0.0611,
  },
  {
    label: 'R-103',
    site: ridgeline,
    product: 'Copper wire nugget',
    conductivitySPerM: iacs(97.8),
    frequencyHz: 60e3,
    temperatureK: celsius(27),
    densityKgPerM3: 8900,
    massKg: 0.0043,
  },
  {
    label: 'R-104',
    site: ridgeline,
    product: 'Zinc die-cast piece',
    conductivitySPerM: iacs(26.4),
    frequencyHz: 60e3,
    temperatureK: celsius(27),
    densityKgPerM3: 6610,
    massKg: 0.0377,
  },
  {
    label: 'R-105',
    site: ridgeline,
    product: 'Stainless fines',
    conductivitySPerM: iacs(2.37),
    frequencyHz: 60e3,
    temperatureK: celsius(27),
    densityKgPerM3: 7980,
    massKg: 0.0021,
  },
  {
    label: 'R-106',
    site: ridgeline,
    product: 'Lead scrap',
    conductivitySPerM: iacs(8.1),
    frequencyHz: 60e3,
    temperatureK: celsius(27),
    densityKgPerM3: 11300,
    massKg: 0.0905,
  },
  {
    label: 'R-107',
    site: ridgeline,
    product: 'Cartridge brass strip offcut',
    conductivitySPerM: iacs(28.0),
    frequencyHz: 60e3,
    temperatureK: celsius(20),
    densityKgPerM3: 8530,
    massKg: 0.0122,
  },
];
