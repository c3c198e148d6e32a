import { assemblyLube } from './assembly-lube';
import { camGear } from './cam-gear';
import { crankcase } from './crankcase';
import { crankshaft } from './crankshaft';
import { cylinderHead } from './cylinder-head';
import { dowelPin10 } from './dowel-pin-10';
import { dowelPin8 } from './dowel-pin-8';
import { feelerGauge } from './feeler-gauge';
import { flangeBolt } from './flange-bolt';
import { flywheel } from './flywheel';
import { flywheelKey } from './flywheel-key';
import { flywheelNut } from './flywheel-nut';
import { flywheelWasher } from './flywheel-washer';
import { headBolt } from './head-bolt';
import { headGasket } from './head-gasket';
import { locatingSleeve } from './locating-sleeve';
import { oilSeal } from './oil-seal';
import { sparkPlug } from './spark-plug';
import { strapWrench } from './strap-wrench';
import { sumpCover } from './sump-cover';
import { sumpGasket } from './sump-gasket';
import type { ModelAnchor, PartModel, Vec3 } from './types';

// Every Wren 160 model by key; procedures name models by these keys.

const ALL_MODELS: PartModel[] = [
  crankcase, crankshaft, camGear, sumpCover, sumpGasket, oilSeal, dowelPin8, dowelPin10, flangeBolt,
  cylinderHead, headGasket, locatingSleeve, headBolt, flywheel, flywheelKey, flywheelWasher, flywheelNut,
  sparkPlug, assemblyLube, strapWrench, feelerGauge,
];

export const MODELS: Readonly<Record<string, PartModel>> = Object.fromEntries(ALL_MODELS.map((m) => [m.key, m]));

export function getModel(key: string): PartModel | undefined {
  return Object.hasOwn(MODELS, key) ? MODELS[key] : undefined;
}

/** Every anchor with the model it sits on. Anchor keys are unique across models, so a key alone finds one. */
export function allAnchors(): { model: PartModel; anchor: ModelAnchor }[] {
  return ALL_MODELS.flatMap((model) => model.anchors.map((anchor) => ({ model, anchor })));
}

export function findAnchor(key: string): { model: PartModel; anchor: ModelAnchor } | undefined {
  return allAnchors().find((entry) => entry.anchor.key === key);
}

/** Anchor key → position in the assembled engine frame. Throws if two models share an anchor key. */
export function anchorPositions(): Record<string, Vec3> {
  const positions: Record<string, Vec3> = {};
  for (const { model, anchor } of allAnchors()) {
    if (Object.hasOwn(positions, anchor.key)) {
      throw new Error(`anchor key "${anchor.key}" appears twice (again on ${model.key})`);
    }
    positions[anchor.key] = anchor.position;
  }
  return positions;
}

export type { ModelAnchor, PartModel, Shape, Vec2, Vec3 } from './types';
