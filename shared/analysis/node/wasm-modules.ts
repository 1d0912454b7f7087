import { readFileSync } from 'node:fs';
import { join } from 'node:path';

/** Node's WebAssembly, as far as used here (this build's TypeScript libraries declare it only with the DOM's). */
declare const WebAssembly: {
  Module: new (bytes: Uint8Array) => WasmModule;
  Instance: new (module: WasmModule, imports: object) => { exports: unknown };
};
/** A compiled WebAssembly module (opaque here). */
type WasmModule = object;

const compiled = new Map<string, WasmModule | null>();

/**
 * The engine's WebAssembly module `name` (wasm/<name>.ts, built into dist/server/<name>.wasm by
 * `node server/cli/run-compiled.js --build`), compiled once per thread; null when the build made
 * none (the engine then does that work in TypeScript). Looked for beside the bundles (this code
 * runs in one of them), then from this source file (jest, tsx).
 */
export function wasmModule(name: string): WasmModule | null {
  if (!compiled.has(name)) {
    compiled.set(name, null);
    for (const file of [join(__dirname, `${name}.wasm`), join(__dirname, '..', '..', '..', 'dist', 'server', `${name}.wasm`)]) {
      try {
        compiled.set(name, new WebAssembly.Module(readFileSync(file)));
        break;
      } catch {
        // Not built there (or not at all): the next place, else none.
      }
    }
  }
  return compiled.get(name)!;
}

/** A new instance of a module from `wasmModule`, its exports typed as the caller knows them. */
export function instantiate<Exports>(module: WasmModule): Exports {
  return new WebAssembly.Instance(module, {}).exports as Exports;
}
