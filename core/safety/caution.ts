/** The caution text of DESIGN.md, shown wherever the program recommends or compares. */
export const CAUTION_TEXT =
  "Suspension changes alter how a vehicle brakes, turns and rides. Figures here come from a simplified model; confirm every change on the vehicle with a qualified vehicle or suspension engineer, stay within the damper and spring makers' limits, check bump-stop and travel clearances on the car, and follow the rules of the sanctioning body.";

/** Beside every valving recommendation and comparison, after CAUTION_TEXT. */
export const VALVING_CAUTION_TEXT =
  "A recommendation is a starting point for testing on the car, not a setting to race on: do not exceed the damper maker's adjustment range; make one change at a time and record it.";
