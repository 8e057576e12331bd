/// The part of the algebra engine the evaluator uses, in one place.
export * from "../algebra/index";
export * from "../algebra/ideal/index";
export * from "../algebra/hilbert/index";
