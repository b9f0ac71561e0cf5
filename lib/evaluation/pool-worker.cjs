// Worker thread of the evaluation pool (lib/evaluation/pool.ts). Plain JavaScript, as the server
// starts it from disk: it registers tsx's CommonJS loader to load the engine's TypeScript sources —
// the very code the request thread runs — and keeps compiled evaluators per content hash.
const { register } = require('tsx/cjs/api');

register();
const { compiled, compiledByKey } = require('../engine/compile.ts');
const { compileChain } = require('../engine/chain.ts');

const chains = new Map();

function compileVersion(v) {
  const parse = () => JSON.parse(v.definitionText);
  return v.contentHash ? compiledByKey(v.contentHash, parse) : compiled(parse());
}

function plain(result) {
  return {
    outputs: result.outputs,
    warnings: [...result.warnings.entries()],
    errors: [...result.errors.entries()].map(([row, e]) => [row, { code: e.code, message: e.message, symbol: e.symbol, warnings: e.warnings }]),
    picks: result.picks ?? [],
  };
}

/** { kind: 'correlation', version, rows, count } or { kind: 'chain', key, definition, pins, rows, count } */
module.exports = function run(task) {
  if (task.kind === 'correlation') return plain(compileVersion(task.version).runMany(task.rows, task.count));
  let chain = task.key ? chains.get(task.key) : undefined;
  if (!chain) {
    const pins = new Map(task.pins.map((p) => [`${p.slug}@${p.version}`, p]));
    chain = compileChain(task.definition, (pin) => compileVersion(pins.get(`${pin.slug}@${pin.version}`)));
    if (task.key) { if (chains.size > 100) chains.clear(); chains.set(task.key, chain); }
  }
  return plain(chain.runMany(task.rows, task.count));
};
