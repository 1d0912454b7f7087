// Jest loads its global set-up and tear-down files outside its module system, so its
// moduleNameMapper does not apply there and the path aliases (`@server/...`) would not resolve.
// Each hook is therefore loaded through tsx, which knows tsconfig.json's paths: the small
// `*-hook.cjs` files beside this one name the TypeScript file of each hook.
'use strict';
require('tsx/cjs');

/** The default export of the TypeScript hook `file` (relative to this folder). */
module.exports = (file) => require(file).default;
