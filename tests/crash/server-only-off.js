/* eslint-disable @typescript-eslint/no-require-imports -- a CommonJS preload, run by node before any loader */
// Preloaded into the reminder crash child: `server-only` resolves to its empty module (as in
// the server), without the react-server condition, under which React's HTML renderer for the
// e-mails refuses to load.
const Module = require('node:module');
const empty = require.resolve('../support/empty.ts');
const resolve = Module._resolveFilename;
Module._resolveFilename = function (request, ...rest) {
  return request === 'server-only' ? empty : resolve.call(this, request, ...rest);
};
