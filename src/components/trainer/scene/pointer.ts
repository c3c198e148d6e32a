import type { ThreeEvent } from '@react-three/fiber';

/** Pixels the pointer may travel between press and release and still count as a click, not an orbit. */
const CLICK_SLOP_PX = 6;

/** A click that ended an orbit drag is not a pick. */
export function isClick(event: ThreeEvent<MouseEvent>): boolean {
  return event.delta <= CLICK_SLOP_PX;
}
