export { minors, det } from "./minors";
export { pfaffians } from "./pfaffians";
export { torLengths, torLengthsOf, serreMultiplicity, serreMultiplicityOf, quotientPresentation } from "./tor";
export { koszulComplex, isRegularSequence, type FreeComplex } from "./koszul";
export { torModule, extModule } from "./homology";
