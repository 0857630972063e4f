/** The caution text of DESIGN.md, shown wherever the program recommends or compares. */
export const CAUTION_TEXT =
  "Suspension changes alter how a vehicle brakes, turns and rides. Figures here come from a simplified model; confirm every change on the vehicle with a qualified vehicle or suspension engineer, stay within the damper and spring makers' limits, check bump-stop and travel clearances on the car, and follow the rules of the sanctioning body.";
