// A PDDL text reduced to what the parser sees — its token sequence (comments and whitespace gone,
// names lower-cased) — so two texts can be compared for "the same model, written differently".
import { tokenize } from "./lexer.js";

/**
 * The token sequence of `text` as one string. Two texts with equal signatures parse to the same
 * syntax tree: the parser reads nothing but these tokens (positions only go into error messages).
 * Throws the lexer's PlumblineError (file:line:col) on text that is not PDDL tokens.
 */
export function tokenSignature(text: string, file: string): string {
  return tokenize(text, file)
    .map((t) => `${t.kind}\u0001${t.text}`)
    .join("\u0002");
}
