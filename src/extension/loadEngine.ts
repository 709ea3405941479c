import * as path from 'node:path';
import type * as EngineModule from './engine';

export type Engine = typeof EngineModule;

let loaded: Engine | undefined;

/**
 * The engine chunk (dist/engine.js beside dist/extension.js; engine.js beside this file when run from
 * tsc output). The path is computed so esbuild leaves the require alone and keeps the chunk separate.
 */
export function loadEngine(): Engine {
  // eslint-disable-next-line @typescript-eslint/no-require-imports -- a lazy chunk is the point: activation must stay light.
  loaded ??= require(path.join(__dirname, 'engine.js')) as Engine;
  return loaded;
}
