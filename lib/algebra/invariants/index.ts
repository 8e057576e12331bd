export { minors, det } from "./minors";
export { pfaffians } from "./pfaffians";
export { torLengths, serreMultiplicity } from "./tor";
export { koszulComplex, type FreeComplex } from "./koszul";
