/** Launch requests the tests and the bench share (values from tests/api/estimates.test.ts). */
const mm = (value: number) => ({ value, unit: 'mm' });

/** A 50 µF, 400 V bank through 100 turns of AWG 26 under a 23 mm gilding-metal blank. */
export const typicalLaunch = {
  bank: {
    capacitance: { value: 50, unit: 'µF' },
    voltage: { value: 400, unit: 'V' },
    seriesResistance: { value: 50, unit: 'mohm' },
  },
  coil: { innerRadius: mm(5), outerRadius: mm(12), length: mm(10), turns: 100, awg: 26 },
  blank: {
    diameter: mm(23),
    layers: [{ material: { alloy: 'gilding-metal-c21000' }, thickness: mm(1.75) }],
  },
  gap: mm(0.5),
};

/** The costliest launch the schema allows: every filament count at its maximum, a plated blank. */
export const heaviestLaunch = {
  ...typicalLaunch,
  blank: {
    diameter: mm(23),
    layers: [
      { material: { alloy: 'copper-c11000' }, thickness: mm(0.05) },
      { material: { alloy: 'zinc-shg' }, thickness: mm(1.65) },
      { material: { alloy: 'copper-c11000' }, thickness: mm(0.05) },
    ],
  },
  filaments: { coilRadial: 12, coilAxial: 12, blankRadial: 24, blankPerLayer: 4 },
};
