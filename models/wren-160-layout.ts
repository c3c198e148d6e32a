import { roundedRect } from './outline';
import type { Vec2, Vec3 } from './types';

// The Wren 160's shared dimensions: mating parts are built from these one set of numbers so their
// holes line up. Metres, engine frame (+Y up along the crankshaft, cylinder along +X).

const DEG = Math.PI / 180;

// Crankshaft and gears (crank axis is the Y axis).
export const CRANK_JOURNAL_RADIUS = 0.0125;
export const CRANK_PTO_END_Y = -0.075;
export const CRANKCASE_TOP_Y = 0.16;
export const BEARING_BOSS_TOP_Y = 0.175;
export const TAPER_TOP_Y = 0.205;
export const TAPER_TOP_RADIUS = 0.0095;
export const THREAD_TOP_Y = 0.227;
export const THREAD_RADIUS = 0.008;
export const KEYWAY_Y = 0.19;
export const GEAR_Y = 0.02;
export const GEAR_THICKNESS = 0.008;
export const CRANK_GEAR_RADIUS = 0.015;
export const CAM_GEAR_RADIUS = 0.03;
/** Cam axis 45 mm from the crank (gear radii 15 + 30 mm, 2:1), toward the cylinder. */
export const CAM_AXIS_XZ: Vec2 = [0.027, -0.036];

/** Taper radius at height y (the taper narrows upward from the journal to the thread). */
export function taperRadiusAt(y: number): number {
  const t = (y - BEARING_BOSS_TOP_Y) / (TAPER_TOP_Y - BEARING_BOSS_TOP_Y);
  return CRANK_JOURNAL_RADIUS + t * (TAPER_TOP_RADIUS - CRANK_JOURNAL_RADIUS);
}

// Flywheel stack on the taper: hub top is flush with the taper top, then washer, then nut.
export const FLYWHEEL_HUB_BOTTOM_Y = 0.177;
export const FLYWHEEL_RADIUS = 0.13;
export const WASHER_THICKNESS = 0.003;
export const NUT_HEIGHT = 0.013;

// Sump joint: crankcase lower face at y = 0, gasket below it, then the sump cover flange.
export const SUMP_FACE_Y = 0;
export const SUMP_GASKET_THICKNESS = 0.0008;
export const SUMP_COVER_TOP_Y = SUMP_FACE_Y - SUMP_GASKET_THICKNESS;
export const SUMP_FLANGE_THICKNESS = 0.008;
export const SUMP_FACE_OUTLINE: Vec2[] = roundedRect(-0.115, 0.115, -0.11, 0.11, 0.03);
export const SUMP_OPENING_RADIUS = 0.08;
export const SUMP_BOLT_COUNT = 8;
export const SUMP_BOLT_CIRCLE_RADIUS = 0.095;
export const SUMP_BOLT_CLEARANCE_RADIUS = 0.0035;
export const DOWEL_8_RADIUS = 0.004;
export const DOWEL_CLEARANCE_RADIUS = 0.0042;
export const SEAL_BORE_RADIUS = 0.02;
/** Sump plates: outline (u, v) lands on engine (x = u, z = v) and the plate extrudes downward (−Y). */
export const SUMP_PLATE_ROTATION: Vec3 = [Math.PI / 2, 0, 0];

/**
 * Sump bolt n (1..8) in the (x, z) plane. Seen from below (looking up +Y, +X to the right, +Z up),
 * clockwise means the angle from +X toward +Z decreases; bolt 1 sits on the cylinder side.
 */
export function sumpBoltXZ(n: number): Vec2 {
  const angle = (22.5 - 45 * (n - 1)) * DEG;
  return [SUMP_BOLT_CIRCLE_RADIUS * Math.cos(angle), SUMP_BOLT_CIRCLE_RADIUS * Math.sin(angle)];
}

/** Dowel holes sit diagonally opposite, between bolts, a little outside the bolt circle. */
export const SUMP_DOWEL_XZ: { a: Vec2; b: Vec2 } = {
  a: [0.1 * Math.cos(45 * DEG), 0.1 * Math.sin(45 * DEG)],
  b: [0.1 * Math.cos(225 * DEG), 0.1 * Math.sin(225 * DEG)],
};

// Cylinder deck at +X: crankcase deck face, head gasket, cylinder head.
export const BORE_Y = 0.085;
export const BORE_RADIUS = 0.034;
export const DECK_X = 0.19;
export const HEAD_GASKET_THICKNESS = 0.001;
export const HEAD_DECK_THICKNESS = 0.014;
export const HEAD_BODY_OUTER_X = 0.225;
export const HEAD_BOLT_CLEARANCE_RADIUS = 0.0045;
export const SLEEVE_OUTER_RADIUS = 0.005;
/** Deck plates: outline (u, v) lands on engine (z = u, y = BORE_Y + v) and the plate extrudes toward −X. */
export const DECK_PLATE_ROTATION: Vec3 = [0, -Math.PI / 2, 0];
/** Deck plate extent: u (= z) from −0.09 to 0.062, the wider side for the fifth bolt; v ±0.07. */
export const DECK_U = { min: -0.09, max: 0.062 };
export const DECK_HALF_V = 0.07;
export const DECK_OUTLINE: Vec2[] = roundedRect(DECK_U.min, DECK_U.max, -DECK_HALF_V, DECK_HALF_V, 0.02);
/** Four bolts around the bore and a fifth off to the valve side (−Z), so they do not share a circle. */
export const HEAD_BOLT_UV: Vec2[] = [
  [0.045, 0.045],
  [-0.045, 0.045],
  [-0.045, -0.045],
  [0.045, -0.045],
  [-0.075, 0.005],
];
export const SLEEVE_UV: { a: Vec2; b: Vec2 } = { a: [0, 0.058], b: [0, -0.058] };
/** Spark plug hole on the head's outer face, a little above the bore axis. */
export const PLUG_UV: Vec2 = [0, 0.02];

/** A deck-plane point (u, v) at engine x. */
export function deckPoint([u, v]: Vec2, x: number = DECK_X): Vec3 {
  return [x, BORE_Y + v, u];
}
