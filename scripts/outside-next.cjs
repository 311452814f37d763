// Scripts and tests run outside Next.js, where nothing maps the `server-only` marker to its empty
// module (Next does that for the server bundle and keeps the throwing one for the browser). A seed
// or bench script is server code, so it gets the empty module too. Preloaded with --require.
const Module = require('node:module');
const path = require('node:path');

const empty = path.join(__dirname, '..', 'node_modules', 'server-only', 'empty.js');
const resolveFilename = Module._resolveFilename;
Module._resolveFilename = function resolveOutsideNext(request, ...rest) {
  return request === 'server-only' ? empty : resolveFilename.call(this, request, ...rest);
};
