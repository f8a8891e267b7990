// Compiles WebAssembly text with wabt, SIMD and bulk memory enabled; shared by the build script and its tests.
import wabtInit from 'wabt';

/** Each module: its text, the generated TypeScript file holding its bytes, and the constant's name. */
export const WASM_MODULES = [
  { wat: 'src/table/structurals.wat', ts: 'src/table/structurals-wasm.ts', name: 'STRUCTURALS_WASM' },
  { wat: 'src/rebin/instant-tally.wat', ts: 'src/rebin/instant-tally-wasm.ts', name: 'INSTANT_TALLY_WASM' },
  { wat: 'src/bins/row-gather.wat', ts: 'src/bins/row-gather-wasm.ts', name: 'ROW_GATHER_WASM' },
];

/** The binary module of `wat` (WebAssembly text), as bytes. */
export async function compileWat(wat, name = 'module.wat') {
  const wabt = await wabtInit();
  const mod = wabt.parseWat(name, wat, { simd: true, bulk_memory: true });
  try {
    mod.validate();
    return new Uint8Array(mod.toBinary({}).buffer);
  } finally {
    mod.destroy();
  }
}

/** The structurals module's bytes (the name its test imports). */
export const compileStructurals = (wat) => compileWat(wat, 'structurals.wat');
