export * from "./monomial";
