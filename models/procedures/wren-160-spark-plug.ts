import type { ProcedureInput } from '~/lib/procedure/schema';
import { cylinderHead, cylinderHeadAnchors } from '../cylinder-head';
import { feelerGauge } from '../feeler-gauge';
import { sparkPlug } from '../spark-plug';
import { CAUTIONS } from './cautions';
import { WREN_160, anchorsFrom, partFrom } from './from-models';

// Spark plug installation on the Wren 160. Numbers are demo values for a fictional engine.

const { plugHole } = cylinderHeadAnchors;

export const wren160SparkPlug: ProcedureInput = {
  slug: 'wren-160-spark-plug',
  title: 'Wren 160: install the spark plug',
  version: 1,
  engine: WREN_160,
  summary:
    'Gap, fit and torque the Wren 160 spark plug, and reconnect the lead last. Demo values for a fictional engine; ' +
    "real work uses the engine maker's specifications.",
  cautions: [CAUTIONS.plugLead, CAUTIONS.coolEngine, CAUTIONS.serviceData],
  demoValues: true,
  stages: ['order', 'wrench', 'final-check'],
  parts: [partFrom(sparkPlug), partFrom(feelerGauge), partFrom(cylinderHead)],
  anchors: anchorsFrom(cylinderHead, [plugHole]),
  steps: [
    {
      key: 'check-gap',
      text: 'Check the plug gap with the feeler gauge: 0.76 mm (0.030 in). The blade should drag lightly.',
      parts: [sparkPlug.key, feelerGauge.key],
    },
    {
      key: 'thread-by-hand',
      text: 'Thread the plug into the head by hand until it seats, so it cannot cross-thread.',
      parts: [sparkPlug.key, cylinderHead.key],
      after: ['check-gap'],
    },
    {
      key: 'torque-plug',
      text: 'Torque the spark plug to 20 N·m.',
      parts: [sparkPlug.key],
      caution: CAUTIONS.serviceData,
      after: ['thread-by-hand'],
    },
    {
      key: 'reconnect-lead',
      text: 'Reconnect the spark plug lead.',
      parts: [sparkPlug.key],
      caution: 'Once the lead is on, turning the engine over can fire the plug: keep clear of the plug and the flywheel.',
      after: ['torque-plug'],
    },
  ],
  fastenerGroups: [
    {
      key: 'spark-plug',
      name: 'Spark plug',
      part: sparkPlug.key,
      axis: plugHole.axis,
      bolts: [{ key: 'plug', anchor: plugHole.key }],
      torque: { value: 20, unit: 'N·m', tolerancePct: 10 },
      passes: [1],
      rule: 'opposite',
    },
  ],
  wrench: {
    group: 'spark-plug',
    dialUnit: 'in·lbf',
    wrenchLength: 10,
    extension: 0,
    lengthUnit: 'in',
    direction: 'forward',
    specShownIn: 'N·m',
  },
  finalCheck: { fastenerCount: 1, crankTurns: 0 },
};
