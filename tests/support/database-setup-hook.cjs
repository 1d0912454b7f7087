'use strict';
// See global-hook.cjs.
module.exports = require('./global-hook.cjs')(require.resolve('./database-setup.ts'));
