export { burchIdeal, burchIndexOfIdeal, burchIndexOfRing, type BurchIndex } from "./burch";
export { cutByLinearForm } from "./substitute";
