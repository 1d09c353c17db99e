/** wink-nlp's output for one text: token values, types, contraction flags and normals, and whether each token follows spaces. */
export interface WinkTokens {
  values: string[];
  types: string[];
  contraction: boolean[];
  /** Normal forms (used for contraction pieces). */
  normals: string[];
  spaced: boolean[];
}
