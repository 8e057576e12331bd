export { standardBasis, localLeadExponents, initialForm, type StandardBasis } from "./basis";
export { homogenisation, homogenise, dehomogenise, totalDegree, order as orderAtOrigin, type Homogenisation } from "./homogenize";
