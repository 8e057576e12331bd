export { Echelon, kernelBasis, rankOf } from "./echelon";
export { GradedQuotient, gradedQuotient, type SparseColumn } from "./piece";
