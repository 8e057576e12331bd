export { type Ideal, ideal, idealFromBasis, idealGroebnerBasis, idealIsUnit } from "./ideal";
export { idealSum, idealProduct, idealPower } from "./arith";
export { idealIntersection, idealIntersectionOf } from "./intersect";
export { idealColon, idealColonElement } from "./colon";
export { idealSaturation, idealSaturationElement } from "./saturate";
export { idealEliminate } from "./eliminate";
export { idealContains, idealIsSubset, idealEquals } from "./compare";
export { initialIdeal, idealIsHomogeneous, idealHilbertSeries, idealDimension, idealCodimension, idealDegree } from "./invariants";
export { exactQuotient } from "./divide";
