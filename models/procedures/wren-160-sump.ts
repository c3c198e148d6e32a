import type { ProcedureInput } from '~/lib/procedure/schema';
import { assemblyLube } from '../assembly-lube';
import { camGear } from '../cam-gear';
import { crankcase, crankcaseAnchors } from '../crankcase';
import { crankshaft } from '../crankshaft';
import { DOWEL_PIN_10_SIZE, dowelPin10 } from '../dowel-pin-10';
import { DOWEL_PIN_8_SIZE, dowelPin8 } from '../dowel-pin-8';
import { flangeBolt } from '../flange-bolt';
import { oilSeal } from '../oil-seal';
import { sumpCover, sumpCoverAnchors } from '../sump-cover';
import { sumpGasket } from '../sump-gasket';
import { CAUTIONS } from './cautions';
import { WREN_160, anchorsFrom, partFrom } from './from-models';

// Sump installation on the Wren 160. Numbers are demo values for a fictional engine.

const { sumpBolts, dowelHoleA, dowelHoleB, crankBearing } = crankcaseAnchors;

export const wren160Sump: ProcedureInput = {
  slug: 'wren-160-sump',
  title: 'Wren 160: install the sump',
  version: 1,
  engine: WREN_160,
  summary:
    'Fit the sump to the Wren 160 crankcase: seal check, two 8 mm dowel pins, a new gasket, lube, timing marks, ' +
    'then eight flange bolts in a cross pattern. Demo values for a fictional engine; real work uses the engine ' +
    "maker's specifications.",
  cautions: [
    CAUTIONS.plugLead, CAUTIONS.coolEngine, CAUTIONS.fuel, CAUTIONS.eyes, CAUTIONS.solventsAndOil, CAUTIONS.serviceData,
  ],
  demoValues: true,
  stages: ['order', 'pins', 'pattern', 'wrench', 'final-check'],
  parts: [
    partFrom(crankcase),
    partFrom(crankshaft),
    partFrom(camGear),
    partFrom(sumpCover),
    partFrom(oilSeal),
    partFrom(sumpGasket),
    partFrom(dowelPin8, { count: 2, pin: DOWEL_PIN_8_SIZE }),
    partFrom(dowelPin10, { pin: DOWEL_PIN_10_SIZE, decoy: true }),
    partFrom(assemblyLube),
    partFrom(flangeBolt, { count: sumpBolts.length }),
  ],
  anchors: [
    ...anchorsFrom(crankcase, [...sumpBolts, dowelHoleA, dowelHoleB, crankBearing]),
    ...anchorsFrom(sumpCover, [sumpCoverAnchors.bearing]),
  ],
  steps: [
    {
      key: 'check-oil-seal',
      text: 'Check the oil seal in the sump cover: seated square in its bore, lip whole and not turned over.',
      parts: [sumpCover.key, oilSeal.key],
    },
    {
      key: 'dowel-pin-a',
      text: 'Tap an 8 mm dowel pin into dowel hole A on the crankcase face.',
      parts: [dowelPin8.key],
      caution: CAUTIONS.eyes,
    },
    {
      key: 'dowel-pin-b',
      text: 'Tap the second 8 mm dowel pin into dowel hole B.',
      parts: [dowelPin8.key],
      caution: CAUTIONS.eyes,
    },
    {
      key: 'fit-gasket',
      text: 'Lay a new sump gasket on the crankcase face over both dowel pins.',
      parts: [sumpGasket.key],
      after: ['dowel-pin-a', 'dowel-pin-b'],
    },
    {
      key: 'lube-cam-and-bearings',
      text: 'Apply assembly lube to the cam gear teeth and the bearing surfaces.',
      parts: [assemblyLube.key, camGear.key, crankshaft.key],
      caution: 'Wipe up any spilled lube at once, keep it and the rags away from sparks and flames, and bin oily rags under local rules.',
    },
    {
      key: 'align-timing-marks',
      text: 'Turn the crankshaft until the timing mark on the crank gear lines up with the mark on the cam gear.',
      parts: [crankshaft.key, camGear.key],
    },
    {
      key: 'seat-sump-cover',
      text: 'Lower the sump cover onto the dowel pins, turning the crankshaft a little until the cover seats flat. Never force it down.',
      parts: [sumpCover.key, crankcase.key, crankshaft.key],
      caution: 'Keep fingers out from between the cover and the crankcase face while it drops onto the pins.',
      after: ['check-oil-seal', 'fit-gasket', 'lube-cam-and-bearings', 'align-timing-marks'],
    },
    {
      key: 'start-bolts-by-hand',
      text: 'Start all eight flange bolts by hand, in any order, a few turns each.',
      parts: [flangeBolt.key],
      after: ['seat-sump-cover'],
    },
    {
      key: 'run-bolts-snug',
      text: 'Run the bolts down snug, working across the cover rather than round it.',
      parts: [flangeBolt.key],
      after: ['start-bolts-by-hand'],
    },
    {
      key: 'torque-cross-pattern',
      text: 'Torque the bolts in a cross pattern in two passes: half the spec, then the full 11 N·m.',
      parts: [flangeBolt.key],
      caution: CAUTIONS.serviceData,
      after: ['run-bolts-snug'],
    },
    {
      key: 'check-once-around',
      text: 'Go round all eight bolts once more at full torque; none should turn.',
      parts: [flangeBolt.key],
      after: ['torque-cross-pattern'],
    },
  ],
  pinSeats: [
    { part: dowelPin8.key, anchor: dowelHoleA.key },
    { part: dowelPin8.key, anchor: dowelHoleB.key },
  ],
  fastenerGroups: [
    {
      key: 'sump-bolts',
      name: 'Sump flange bolts',
      part: flangeBolt.key,
      axis: sumpBolts[0]!.axis,
      // Listed in hole order, clockwise seen from below, as the cross rule expects.
      bolts: sumpBolts.map((hole, i) => ({ key: `bolt-${i + 1}`, anchor: hole.key })),
      torque: { value: 11, unit: 'N·m', tolerancePct: 10 },
      passes: [0.5, 1],
      rule: 'cross',
    },
  ],
  wrench: {
    group: 'sump-bolts',
    dialUnit: 'in·lbf',
    wrenchLength: 10,
    extension: 0,
    lengthUnit: 'in',
    direction: 'forward',
    specShownIn: 'N·m',
  },
  finalCheck: { fastenerCount: sumpBolts.length, crankTurns: 2 },
};
