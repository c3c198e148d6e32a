// Our own colour choices: a learner should tell metal, gasket, gear and rubber apart at a glance.
export const PALETTE = {
  castAluminium: '#a9b1b8',
  castAluminiumDark: '#7f8a94',
  steel: '#c2c8ce',
  darkSteel: '#5b6570',
  gasketFibre: '#b8895c',
  gearBrass: '#c9a447',
  blackPlastic: '#26282c',
  sealRubber: '#3b3330',
  porcelain: '#eeebe2',
  markPaint: '#fbfbf5',
  strapNylon: '#d4682c',
  lubeTube: '#2f6fb0',
} as const;

export type PaletteColor = (typeof PALETTE)[keyof typeof PALETTE];
