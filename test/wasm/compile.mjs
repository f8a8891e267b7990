// Compiles WebAssembly text with wabt, SIMD enabled; shared by the build script and its test.
import wabtInit from 'wabt';

/** The binary module of `wat` (WebAssembly text), as bytes. */
export async function compileStructurals(wat) {
  const wabt = await wabtInit();
  const mod = wabt.parseWat('structurals.wat', wat, { simd: true, bulk_memory: true });
  try {
    mod.validate();
    return new Uint8Array(mod.toBinary({}).buffer);
  } finally {
    mod.destroy();
  }
}
