// The PDDL front end's public surface: parse domain and problem files into checked
// syntax trees with source positions (later stages import only this file).
export * from "./ast.js";
export { parseDomain } from "./domain.js";
export { parseProblem } from "./problem.js";
export { loadModel, modelFromTexts, bindProblem, Symbols, type Model, type CostValue } from "./model.js";
export { TypeTable, typeSpecText } from "./types.js";
export { SUPPORTED_REQUIREMENTS, REFUSED_REQUIREMENTS } from "./requirements.js";
export { atomText, formulaText, termText } from "./print.js";
export { readSexprs, type SNode, type SList, type SAtom } from "./sexpr.js";
export { cartesian } from "./cartesian.js";
export { tokenSignature } from "./signature.js";
