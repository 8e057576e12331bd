export { minors, det } from "./minors";
export { pfaffians } from "./pfaffians";
