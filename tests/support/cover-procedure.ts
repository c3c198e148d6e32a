import { getModel } from '../../models/index';
import { CAUTIONS } from '../../models/procedures/cautions';
import { anchorAxis, boltKeyFor, partFromModel, withAnchors } from '../../src/lib/editor/library';
import { applyMarks } from '../../src/lib/editor/ordering';
import type { ProcedureInput } from '../../src/lib/procedure/schema';

// A small four-bolt cover job built from the part library with the editor's own helpers, as an instructor
// would build it in the editor: the sump cover on every other sump bolt hole. Demo values for a fictional engine.

export const COVER_BOLT_HOLES = ['sump-bolt-1', 'sump-bolt-3', 'sump-bolt-5', 'sump-bolt-7'];

export const COVER_STEPS = [
  { key: 'step-pins', text: 'Tap an 8 mm dowel pin into each dowel hole on the crankcase face.', parts: ['dowel-pin-8'] },
  { key: 'step-gasket', text: 'Lay a new sump gasket on the crankcase face over both pins.', parts: ['sump-gasket'] },
  { key: 'step-face', text: 'Check the sealing face of the cover is clean and flat.', parts: ['sump-cover'] },
  { key: 'step-seat', text: 'Lower the cover onto the pins until it sits flat; never force it.', parts: ['sump-cover', 'crankcase'] },
  { key: 'step-bolts', text: 'Start the four flange bolts by hand, then torque them across the cover.', parts: ['flange-bolt'] },
];
/** The gasket and the cover check may come in either order. */
export const COVER_ANY_ORDER = [false, false, true, false, false];

export function coverProcedure(slug = 'cover-four-bolt'): ProcedureInput {
  const model = (key: string) => getModel(key)!;
  const parts = [
    partFromModel(model('crankcase'), []),
    partFromModel(model('sump-cover'), []),
    partFromModel(model('sump-gasket'), []),
    { ...partFromModel(model('dowel-pin-8'), []), count: 2 },
    { ...partFromModel(model('dowel-pin-10'), []), decoy: true },
    { ...partFromModel(model('flange-bolt'), []), count: 4 },
  ];
  const anchors = withAnchors([], ['dowel-hole-a', 'dowel-hole-b', ...COVER_BOLT_HOLES], parts);
  const taken: string[] = [];
  const bolts = COVER_BOLT_HOLES.map((anchor) => {
    const key = boltKeyFor(anchor, taken);
    taken.push(key);
    return { key, anchor };
  });
  return {
    slug,
    title: 'Sump cover, four-bolt practice',
    version: 1,
    engine: { key: 'wren-160', name: 'Wren 160' },
    summary: "Demo values for a fictional engine; real work uses the engine maker's specifications.",
    cautions: [CAUTIONS.plugLead, CAUTIONS.serviceData],
    demoValues: true,
    stages: ['order', 'pins', 'pattern', 'wrench', 'final-check'],
    parts,
    anchors,
    steps: applyMarks(COVER_STEPS.map((s) => ({ ...s, parts: [...s.parts], after: [] as string[] })), COVER_ANY_ORDER),
    pinSeats: [
      { part: 'dowel-pin-8', anchor: 'dowel-hole-a' },
      { part: 'dowel-pin-8', anchor: 'dowel-hole-b' },
    ],
    fastenerGroups: [
      {
        key: 'bolts',
        name: 'Cover bolts',
        part: 'flange-bolt',
        axis: anchorAxis(COVER_BOLT_HOLES[0]!),
        bolts,
        torque: { value: 11, unit: 'N·m', tolerancePct: 10 },
        passes: [0.5, 1],
        rule: 'cross',
      },
    ],
    wrench: { group: 'bolts', dialUnit: 'in·lbf', wrenchLength: 10, extension: 0, lengthUnit: 'in', direction: 'forward', specShownIn: 'N·m' },
    finalCheck: { fastenerCount: 4, crankTurns: 1 },
  };
}
