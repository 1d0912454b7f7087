'use strict';
// See global-hook.cjs.
module.exports = require('./global-hook.cjs')(require.resolve('./browser-setup.ts'));
