// One correct answer for each stage, worked out from the procedure itself as a careful learner would:
// for hints and previews, and for the tests and the benchmark, which expect full marks for it.
import type { Procedure, Stage } from './schema';
import { topoOrder } from './graph';
import { exampleSequence } from '../patterns';
import { groupBoltPositions } from '../scoring/pattern';
import { expectedWrenchSetting } from '../scoring/wrench';
import { passSchedule } from '../wrench';

export function correctAnswer(procedure: Procedure, stage: Stage): unknown {
  switch (stage) {
    case 'order':
      return { sequence: topoOrder(procedure.steps) };
    case 'pins':
      return { placements: procedure.pinSeats.map((s) => ({ part: s.part, anchor: s.anchor })) };
    case 'pattern': {
      const group = procedure.fastenerGroups[0]!;
      const positions = Object.fromEntries(procedure.anchors.map((a) => [a.key, a.position]));
      const sequence = exampleSequence(groupBoltPositions(group, positions), group.axis, group.rule);
      const torques = passSchedule(group.torque.value, group.passes);
      return { group: group.key, passes: torques.map((torque) => ({ torque, sequence })) };
    }
    case 'wrench': {
      const task = procedure.wrench!;
      const spec = procedure.fastenerGroups.find((g) => g.key === task.group)!.torque;
      return { setting: expectedWrenchSetting(task, spec).setting, unit: task.dialUnit };
    }
    case 'final-check':
      return { fastenersCounted: procedure.finalCheck!.fastenerCount, crankTurns: procedure.finalCheck!.crankTurns, leftover: 0 };
  }
}
