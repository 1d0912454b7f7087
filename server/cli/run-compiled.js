// Runs a command as compiled JavaScript, so it starts without a TypeScript loader:
//   node server/cli/run-compiled.js <command file.ts> [arguments...]
//   node server/cli/run-compiled.js --build          (the postinstall step: compile only)
// Each command, the analysis worker process and the engine's range worker are bundled by esbuild (its packages included: one
// file loads faster than a hundred) into dist/server/<name>.js, all in one folder, so a bundle
// finds the range worker's bundle beside itself as the TypeScript finds range-worker.ts. The
// bundles are made again whenever a source or the lock file is newer than the last build. Without
// esbuild (an install without dev dependencies) the command runs through tsx instead. The engine's
// WebAssembly (wasm/*.ts, AssemblyScript: the row kernel, the line count) is compiled to
// dist/server/<name>.wasm beside them; without it the engine does that work in TypeScript alone.
// Plain JavaScript: this file is what runs before anything is compiled.
'use strict';
const fs = require('node:fs');
const path = require('node:path');

const ROOT = path.resolve(__dirname, '..', '..');
const SOURCE_FOLDERS = ['server', 'shared', 'bench', 'fixtures', 'migrations', 'seeders', 'wasm'];
/**
 * The engine's WebAssembly: wasm/<name>.ts compiled to dist/server/<name>.wasm (found there by
 * shared/analysis/node/wasm-modules.ts), with each one's compiler options (see its source).
 */
const WASM_MODULES = {
  'row-kernel': ['--memoryBase', '262144', '--initialMemory', '5'],
  'line-count': ['--enable', 'simd', '--memoryBase', '1024', '--initialMemory', '2'],
};
/** The bundles: command file → bundle name. */
const ENTRIES = {
  'server/cli/analyse.ts': 'analyse',
  'server/cli/verify.ts': 'verify',
  'server/cli/plan.ts': 'plan',
  'server/cli/keylength.ts': 'keylength',
  'shared/analysis/node/range-worker.ts': 'range-worker',
  'shared/analysis/stations/node/station-reader-thread.ts': 'station-reader-thread',
  'bench/engine.ts': 'bench-engine',
  'bench/measure-engine.ts': 'measure-engine',
  'bench/measure-gunzip.ts': 'measure-gunzip',
  'bench/measure-parts.ts': 'measure-parts',
  'bench/keylength.ts': 'bench-keylength',
};
/**
 * Long-running processes, bundled from our own sources only: their packages (Sequelize, pg-boss,
 * nodemailer...) load from node_modules as usual, since some of them require modules by computed
 * names a bundle cannot see.
 */
const PROCESS_ENTRIES = {
  'server/worker/main.ts': 'worker',
  'server/api-main.ts': 'api',
  'server/planner/general-plan-thread-entry.ts': 'general-plan-thread-entry',
};

/** The migrations and seeders the compiled API applies, as `<folder>/<name>.js` beside it (see server/database/migrate.ts). */
function schemaEntries() {
  const entries = {};
  for (const folder of ['migrations', 'seeders', 'seeders/history']) {
    const files = fs.existsSync(path.join(ROOT, folder)) ? fs.readdirSync(path.join(ROOT, folder)) : [];
    for (const name of files.filter((file) => file.endsWith('.ts') && !file.endsWith('.spec.ts') && !file.endsWith('.d.ts'))) {
      entries[`${folder}/${name.slice(0, -'.ts'.length)}`] = path.join(ROOT, folder, name);
    }
  }
  return entries;
}
const ALL_ENTRIES = { ...ENTRIES, ...PROCESS_ENTRIES };
const OUT = path.join(ROOT, 'dist', 'server');
/** Written last by a build, with the time the build began. */
const STAMP = path.join(OUT, '.built');

/** The newest change time of the TypeScript sources (specs left out) and of the lock file. */
function newestSource() {
  let newest = fs.statSync(path.join(ROOT, 'package-lock.json'), { throwIfNoEntry: false })?.mtimeMs ?? 0;
  const walk = (folder) => {
    for (const entry of fs.readdirSync(folder, { withFileTypes: true })) {
      const file = path.join(folder, entry.name);
      if (entry.isDirectory()) {
        walk(file);
      } else if (entry.name.endsWith('.ts') && !entry.name.endsWith('.spec.ts')) {
        newest = Math.max(newest, fs.statSync(file).mtimeMs);
      }
    }
  };
  SOURCE_FOLDERS.map((folder) => path.join(ROOT, folder))
    .filter((folder) => fs.existsSync(folder))
    .forEach(walk);
  return newest;
}

function builtAt() {
  try {
    return fs.statSync(STAMP).mtimeMs;
  } catch {
    return -1;
  }
}

/**
 * Compiles into a folder of its own and moves it into place, so a command starting meanwhile never
 * sees half a build. Returns false when esbuild is not installed or the build fails.
 */
function build() {
  let esbuild;
  try {
    esbuild = require('esbuild');
  } catch {
    return false;
  }
  const staging = `${OUT}.${process.pid}`;
  const started = new Date();
  fs.rmSync(staging, { recursive: true, force: true });
  const entryPoints = (entries) => Object.fromEntries(Object.entries(entries).map(([file, name]) => [name, path.join(ROOT, file)]));
  const common = { outdir: staging, bundle: true, format: 'cjs', platform: 'node', target: 'node20', logLevel: 'error' };
  try {
    esbuild.buildSync({ ...common, entryPoints: entryPoints(ENTRIES) });
    esbuild.buildSync({ ...common, entryPoints: { ...entryPoints(PROCESS_ENTRIES), ...schemaEntries() }, packages: 'external' });
  } catch (error) {
    // A failed build never stops an install or a command: the TypeScript still runs through tsx.
    fs.rmSync(staging, { recursive: true, force: true });
    process.stderr.write(`run-compiled: the build failed (${error.message.split('\n')[0]}); running through tsx\n`);
    return false;
  }
  buildWasmModules(staging);
  // Dated when the build began, so a source saved during the build is newer than it.
  fs.writeFileSync(path.join(staging, '.built'), '');
  fs.utimesSync(path.join(staging, '.built'), started, started);
  const old = `${OUT}.old.${process.pid}`;
  if (fs.existsSync(OUT)) fs.renameSync(OUT, old);
  fs.renameSync(staging, OUT);
  fs.rmSync(old, { recursive: true, force: true });
  return true;
}

/**
 * Compiles each of the engine's WebAssembly modules into `staging` with the AssemblyScript compiler
 * (some seconds each), or keeps the last build's when its source has not changed since. Without
 * the compiler, or when it fails, that module is missing, and the engine does its work in
 * TypeScript instead.
 */
function buildWasmModules(staging) {
  const compiler = path.join(ROOT, 'node_modules', 'assemblyscript', 'bin', 'asc.js');
  for (const [name, moduleOptions] of Object.entries(WASM_MODULES)) {
    const source = path.join(ROOT, 'wasm', `${name}.ts`);
    const built = path.join(OUT, `${name}.wasm`);
    const builtTime = fs.statSync(built, { throwIfNoEntry: false })?.mtimeMs ?? -1;
    if (builtTime >= fs.statSync(source).mtimeMs) {
      fs.copyFileSync(built, path.join(staging, `${name}.wasm`));
      continue;
    }
    const { execFileSync } = require('node:child_process');
    const options = ['-O3', '--runtime', 'stub', '--noAssert', ...moduleOptions];
    try {
      execFileSync(process.execPath, [compiler, source, ...options, '-o', path.join(staging, `${name}.wasm`)], { stdio: ['ignore', 'ignore', 'pipe'] });
    } catch (error) {
      process.stderr.write(`run-compiled: no ${name}.wasm (${String(error.message).split('\n')[0]}); the engine does without it\n`);
    }
  }
}

/** Held while one process builds; another waits for it rather than building beside it. */
const LOCK = `${OUT}.lock`;
const LOCK_GIVEN_UP_MS = 120_000;

/** Runs `work` holding the build lock; a lock older than two minutes was left by a killed build. */
function withBuildLock(work) {
  for (;;) {
    try {
      fs.mkdirSync(LOCK, { recursive: false });
      break;
    } catch (error) {
      if (error.code !== 'EEXIST') throw error;
      const age = Date.now() - (fs.statSync(LOCK, { throwIfNoEntry: false })?.mtimeMs ?? Date.now());
      if (age > LOCK_GIVEN_UP_MS) fs.rmSync(LOCK, { recursive: true, force: true });
      else Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, 50);
    }
  }
  try {
    return work();
  } finally {
    fs.rmSync(LOCK, { recursive: true, force: true });
  }
}

/** Compiles when a source is newer than the build; false when the TypeScript must run as it is. */
function ensureBuilt() {
  const newest = newestSource();
  if (builtAt() >= newest) return true;
  fs.mkdirSync(path.dirname(OUT), { recursive: true });
  // Another process may have built while this one waited for the lock.
  return withBuildLock(() => builtAt() >= newest || build());
}

/**
 * Loads a bundle as `require` would, with V8's code cache kept beside it (`<name>.code-cache`,
 * written when a run ends without a usable one): compiling a megabyte of bundle costs more than
 * reading what V8 made of it last time. A new build replaces the folder, and with it the caches.
 */
function requireWithCodeCache(file) {
  const vm = require('node:vm');
  const Module = require('node:module');
  const cacheFile = file.replace(/\.js$/, '.code-cache');
  const cached = fs.existsSync(cacheFile) ? fs.readFileSync(cacheFile) : undefined;
  const script = new vm.Script(Module.wrap(fs.readFileSync(file, 'utf8')), { filename: file, cachedData: cached });
  if (cached === undefined || script.cachedDataRejected) {
    process.once('exit', () => {
      // Written aside and renamed, so a command starting meanwhile never reads half a cache.
      const aside = `${cacheFile}.${process.pid}`;
      try {
        fs.writeFileSync(aside, script.createCachedData());
        fs.renameSync(aside, cacheFile);
      } catch {
        fs.rmSync(aside, { force: true });
      }
    });
  }
  const module = new Module(file, null);
  module.filename = file;
  module.paths = Module._nodeModulePaths(path.dirname(file));
  require.cache[file] = module;
  script.runInThisContext().call(module.exports, module.exports, Module.createRequire(file), module, file, path.dirname(file));
  module.loaded = true;
}

const [target, ...rest] = process.argv.slice(2);
if (target === '--build') {
  fs.mkdirSync(path.dirname(OUT), { recursive: true });
  if (!withBuildLock(build)) process.stderr.write('run-compiled: no build; the commands will run through tsx\n');
} else if (!(target in ALL_ENTRIES)) {
  process.stderr.write(`usage: node server/cli/run-compiled.js <command.ts> [arguments...] | --build\ncommands: ${Object.keys(ALL_ENTRIES).join(', ')}\n`);
  process.exitCode = 2;
} else {
  const source = path.resolve(ROOT, target);
  const compiled = ensureBuilt();
  // The command reads its arguments from process.argv.slice(2), as when started directly.
  process.argv = [process.argv[0], source, ...rest];
  if (compiled) {
    requireWithCodeCache(path.join(OUT, `${ALL_ENTRIES[target]}.js`));
  } else {
    require('tsx/cjs');
    require(source);
  }
}
