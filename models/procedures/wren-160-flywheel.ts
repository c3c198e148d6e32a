import type { ProcedureInput } from '~/lib/procedure/schema';
import { crankshaft, crankshaftAnchors } from '../crankshaft';
import { flywheel } from '../flywheel';
import { flywheelKey } from '../flywheel-key';
import { flywheelNut } from '../flywheel-nut';
import { flywheelWasher } from '../flywheel-washer';
import { strapWrench } from '../strap-wrench';
import { CAUTIONS } from './cautions';
import { WREN_160, anchorsFrom, partFrom } from './from-models';

// Flywheel installation on the Wren 160. Numbers are demo values for a fictional engine.
// One nut has no tightening pattern, so there is no Pattern stage; it is still a one-fastener group for the Wrench stage.

const { flywheelKeyway, threadEnd } = crankshaftAnchors;

export const wren160Flywheel: ProcedureInput = {
  slug: 'wren-160-flywheel',
  title: 'Wren 160: install the flywheel',
  version: 1,
  engine: WREN_160,
  summary:
    'Fit the Wren 160 flywheel: clean taper, key, flywheel, washer and nut, held with a strap wrench while the nut ' +
    "is torqued. Demo values for a fictional engine; real work uses the engine maker's specifications.",
  cautions: [
    CAUTIONS.plugLead, CAUTIONS.coolEngine, CAUTIONS.fuel, CAUTIONS.eyes, CAUTIONS.solventsAndOil, CAUTIONS.serviceData,
  ],
  demoValues: true,
  stages: ['order', 'wrench', 'final-check'],
  parts: [
    partFrom(crankshaft),
    partFrom(flywheelKey),
    partFrom(flywheel),
    partFrom(flywheelWasher),
    partFrom(flywheelNut),
    partFrom(strapWrench),
  ],
  anchors: anchorsFrom(crankshaft, [flywheelKeyway, threadEnd]),
  steps: [
    {
      key: 'clean-taper',
      text: 'Clean the crankshaft taper and the flywheel bore dry: no oil or grease on either.',
      parts: [crankshaft.key, flywheel.key],
      caution: CAUTIONS.solventsAndOil,
    },
    {
      key: 'fit-flywheel-key',
      text: 'Set the flywheel key in the crankshaft keyway.',
      parts: [flywheelKey.key],
      after: ['clean-taper'],
    },
    {
      key: 'fit-flywheel',
      text: 'Slide the flywheel onto the taper with its keyway over the key.',
      parts: [flywheel.key],
      after: ['fit-flywheel-key'],
    },
    {
      key: 'fit-washer',
      text: 'Put the washer on over the thread.',
      parts: [flywheelWasher.key],
      after: ['fit-flywheel'],
    },
    {
      key: 'start-nut',
      text: 'Thread the flywheel nut on by hand.',
      parts: [flywheelNut.key],
      after: ['fit-washer'],
    },
    {
      key: 'hold-with-strap',
      text: 'Wrap the strap wrench round the flywheel rim to hold it still.',
      parts: [strapWrench.key],
      caution: 'Hold the flywheel with the strap only. A bar wedged in the fins can snap them and the hand can slip onto sharp edges.',
      after: ['fit-flywheel'],
    },
    {
      key: 'torque-nut',
      text: 'Torque the flywheel nut to 65 N·m while the strap holds the flywheel.',
      parts: [flywheelNut.key],
      caution: CAUTIONS.serviceData,
      after: ['start-nut', 'hold-with-strap'],
    },
  ],
  fastenerGroups: [
    {
      key: 'flywheel-nut',
      name: 'Flywheel nut',
      part: flywheelNut.key,
      axis: threadEnd.axis,
      bolts: [{ key: 'nut', anchor: threadEnd.key }],
      torque: { value: 65, unit: 'N·m', tolerancePct: 10 },
      passes: [1],
      rule: 'opposite',
    },
  ],
  // The adapter points back toward the handle, so the lever is L − E: a good case for the Wrench stage.
  wrench: {
    group: 'flywheel-nut',
    dialUnit: 'ft·lbf',
    wrenchLength: 15,
    extension: 2,
    lengthUnit: 'in',
    direction: 'back',
    specShownIn: 'N·m',
  },
  finalCheck: { fastenerCount: 1, crankTurns: 2 },
};
