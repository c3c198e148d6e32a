import { KeyboardSensor, PointerSensor, TouchSensor, useSensor, useSensors, type Announcements, type ScreenReaderInstructions } from '@dnd-kit/core';
import { sortableKeyboardCoordinates } from '@dnd-kit/sortable';

// Dragging steps into order, the same in the trainer's Order stage and the editor's step list.

/** Mouse after a small move, touch after a short hold (so the page still scrolls), and the keyboard. */
export function useStepListSensors() {
  return useSensors(
    useSensor(PointerSensor, { activationConstraint: { distance: 6 } }),
    useSensor(TouchSensor, { activationConstraint: { delay: 150, tolerance: 8 } }),
    useSensor(KeyboardSensor, { coordinateGetter: sortableKeyboardCoordinates }),
  );
}

/**
 * What a screen reader hears: how to move a step by keyboard, then while it is dragged, its position and
 * its words. For DndContext's `accessibility`.
 */
export function stepListAccessibility(
  position: (id: string | number) => number,
  words: (id: string | number) => string,
): { announcements: Announcements; screenReaderInstructions: ScreenReaderInstructions } {
  return {
    announcements: {
      onDragStart: ({ active }) => `Picked up step ${position(active.id)}: ${words(active.id)}`,
      onDragOver: ({ active, over }) => (over ? `Step ${position(active.id)} is over position ${position(over.id)}` : 'Not over the list'),
      onDragEnd: ({ active, over }) => (over ? `Dropped at position ${position(over.id)}: ${words(active.id)}` : 'Dropped where it was'),
      onDragCancel: ({ active }) => `Put back: ${words(active.id)}`,
    },
    screenReaderInstructions: {
      draggable: 'To move a step, press Space or Enter to pick it up, the up and down arrows to move it, and Space or Enter again to drop it. Escape puts it back.',
    },
  };
}
