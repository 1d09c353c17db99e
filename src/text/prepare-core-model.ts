/** The parts of wink-eng-lite-web-model's core model read by lexichron (see loadCoreModel). */
export interface CoreModel {
  lexicon: Uint32Array | string;
  xpansions: Uint32Array | string;
  packing: { layout: Record<string, number[]>; efList: string[] };
  features: Record<string, { list: unknown[]; hash: Record<string, number>; intrinsicSize: number; index: number; maxIndex: number }> & {
    lexeme: { list: unknown[]; hash: Record<string, number>; intrinsicSize: number; index: number };
    posClusters: { list: unknown[] };
  };
  pos: { hash: Record<string, number> };
  trex: unknown;
  tcat: { hash: Record<string, number> };
  preserve: unknown;
}

/** A fresh ArrayBuffer holding the bytes of base64 `data`. */
function bytesOfBase64(data: string): ArrayBuffer {
  const bytes = Buffer.from(data, 'base64');
  return bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength) as ArrayBuffer;
}

/**
 * wink-eng-lite-web-model's core model from the text of its model file (read by
 * readCoreModel, src/io/read-core-model.ts), prepared as the package's own `core()` prepares it
 * (dist/read-core-model.js and dist/load-core-model.js of version 1.8.1), with two cheaper
 * steps: the file parsed once into a fresh object (the package loads it with `require` and
 * copies it through a JSON round trip), and Node's base64 decoder instead of a character loop.
 * About 0.17 s less per start of the tool and of each scoring worker.
 * test/fast/tokenize-english.test.ts checks the tokens equal those of the package's own loader.
 */
export function prepareCoreModel(json: string): CoreModel {
  const core = JSON.parse(json) as CoreModel;
  const { packing, features, pos } = core;
  core.lexicon = new Uint32Array(bytesOfBase64(core.lexicon as string));
  core.xpansions = new Uint32Array(bytesOfBase64(core.xpansions as string));
  for (const f in packing.layout) {
    if (packing.layout[f]![3] !== 0) continue;
    const feature = features[f]!;
    const hash: Record<string, number> = Object.create(null);
    for (let k = 0; k < feature.list.length; k++) hash[feature.list[k] as string] = k;
    feature.hash = hash;
  }
  const lexemeHash: Record<string, number> = Object.create(null);
  for (let k = 0; k < features.lexeme.list.length; k++) lexemeHash[features.lexeme.list[k] as string] = k;
  features.lexeme.hash = lexemeHash;
  const clusters = features.posClusters.list;
  for (let k = 0; k < clusters.length; k++) clusters[k] = new Set((clusters[k] as string).split('_').map((e) => pos.hash[e] || 0));
  packing.efList = [];
  for (const f in packing.layout) {
    const layout = packing.layout[f]!;
    if (layout[3] === 0) {
      const feature = features[f]!;
      feature.intrinsicSize = feature.list.length;
      feature.index = feature.list.length;
      feature.maxIndex = layout[1]! >>> layout[2]!;
    }
    if (layout[4] === 1) packing.efList.push(f);
  }
  features.lexeme.intrinsicSize = features.lexeme.list.length;
  features.lexeme.index = features.lexeme.list.length;
  return core;
}

