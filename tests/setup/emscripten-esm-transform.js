// jest runs the Node projects as CommonJS. The engine's FFT, @echogarden/pffft-wasm (audio/analysis/spectrum.ts),
// is an ES module whose Emscripten loader finds its .wasm through import.meta.url and imports Node's 'module';
// babel turns the import/export syntax into CommonJS but leaves those two, which jest's CommonJS runtime cannot
// run. This transform gives them their CommonJS equivalents, then hands the file to babel-jest. Only jest uses it:
// the server and the scripts load the package as the ES module it is.
const babelJest = require('babel-jest').default.createTransformer();

const VERSION = 'emscripten-esm-1';

function toCommonJs(source) {
  // The loader declares a `require` of its own inside its factory, so Node's is kept under another name first.
  return (
    'const __moduleUrl = require("url").pathToFileURL(__filename).href; const __nodeRequire = require;\n' +
    source.replaceAll('import.meta.url', '__moduleUrl').replaceAll('await import("module")', '__nodeRequire("module")')
  );
}

module.exports = {
  process(source, filename, options) {
    return babelJest.process(toCommonJs(source), filename, options);
  },
  getCacheKey(source, filename, options) {
    return `${VERSION}:${babelJest.getCacheKey(source, filename, options)}`;
  },
};
