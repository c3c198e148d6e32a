import type { ProcedureInput } from '~/lib/procedure/schema';
import { crankcase, crankcaseAnchors } from '../crankcase';
import { cylinderHead } from '../cylinder-head';
import { headBolt } from '../head-bolt';
import { headGasket } from '../head-gasket';
import { LOCATING_SLEEVE_SIZE, locatingSleeve } from '../locating-sleeve';
import { CAUTIONS } from './cautions';
import { WREN_160, anchorsFrom, partFrom } from './from-models';

// Cylinder head installation on the Wren 160. Numbers are demo values for a fictional engine.

const { headBolts, sleeveHoleA, sleeveHoleB } = crankcaseAnchors;

export const wren160Head: ProcedureInput = {
  slug: 'wren-160-head',
  title: 'Wren 160: install the cylinder head',
  version: 1,
  engine: WREN_160,
  summary:
    'Fit the Wren 160 cylinder head: a new head gasket, two locating sleeves, five head bolts taken up in three ' +
    "passes. Demo values for a fictional engine; real work uses the engine maker's specifications.",
  cautions: [
    CAUTIONS.plugLead, CAUTIONS.coolEngine, CAUTIONS.fuel, CAUTIONS.eyes, CAUTIONS.solventsAndOil, CAUTIONS.serviceData,
  ],
  demoValues: true,
  stages: ['order', 'pins', 'pattern', 'wrench', 'final-check'],
  parts: [
    partFrom(crankcase),
    partFrom(cylinderHead),
    partFrom(headGasket),
    partFrom(locatingSleeve, { count: 2, pin: LOCATING_SLEEVE_SIZE }),
    partFrom(headBolt, { count: headBolts.length }),
  ],
  anchors: anchorsFrom(crankcase, [...headBolts, sleeveHoleA, sleeveHoleB]),
  steps: [
    {
      key: 'clean-deck-faces',
      text: 'Wipe the cylinder deck and the head face clean and dry, with no old gasket left on either.',
      parts: [crankcase.key, cylinderHead.key],
      caution: CAUTIONS.solventsAndOil,
    },
    {
      key: 'sleeve-a',
      text: 'Press a locating sleeve into sleeve hole A in the deck.',
      parts: [locatingSleeve.key],
    },
    {
      key: 'sleeve-b',
      text: 'Press the second locating sleeve into sleeve hole B.',
      parts: [locatingSleeve.key],
    },
    {
      key: 'fit-head-gasket',
      text: 'Fit a new head gasket on the deck over both sleeves.',
      parts: [headGasket.key],
      after: ['clean-deck-faces', 'sleeve-a', 'sleeve-b'],
    },
    {
      key: 'seat-head',
      text: 'Set the cylinder head on the gasket so both sleeves enter it, and let it sit flat.',
      parts: [cylinderHead.key],
      after: ['fit-head-gasket'],
    },
    {
      key: 'start-head-bolts',
      text: 'Start all five head bolts by hand, in any order.',
      parts: [headBolt.key],
      after: ['seat-head'],
    },
    {
      key: 'snug-head-bolts',
      text: 'Run the head bolts down snug, from the middle out.',
      parts: [headBolt.key],
      after: ['start-head-bolts'],
    },
    {
      key: 'torque-head-bolts',
      text: 'Torque the head bolts in three passes (one third, two thirds, then the full 24 N·m), each next bolt across from the last.',
      parts: [headBolt.key],
      caution: CAUTIONS.serviceData,
      after: ['snug-head-bolts'],
    },
    {
      key: 'check-head-bolts',
      text: 'Check all five head bolts once more at full torque.',
      parts: [headBolt.key],
      after: ['torque-head-bolts'],
    },
  ],
  pinSeats: [
    { part: locatingSleeve.key, anchor: sleeveHoleA.key },
    { part: locatingSleeve.key, anchor: sleeveHoleB.key },
  ],
  fastenerGroups: [
    {
      key: 'head-bolts',
      name: 'Head bolts',
      part: headBolt.key,
      axis: headBolts[0]!.axis,
      bolts: headBolts.map((hole, i) => ({ key: `bolt-${i + 1}`, anchor: hole.key })),
      torque: { value: 24, unit: 'N·m', tolerancePct: 10 },
      passes: [1 / 3, 2 / 3, 1],
      rule: 'opposite',
    },
  ],
  wrench: {
    group: 'head-bolts',
    dialUnit: 'in·lbf',
    wrenchLength: 12,
    extension: 2,
    lengthUnit: 'in',
    direction: 'forward',
    specShownIn: 'N·m',
  },
  finalCheck: { fastenerCount: headBolts.length, crankTurns: 2 },
};
