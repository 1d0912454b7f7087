import { setupZonelessTestEnv } from 'jest-preset-angular/setup-env/zoneless';

setupZonelessTestEnv({
  errorOnUnknownElements: true,
  errorOnUnknownProperties: true,
});

// Node's module loader, typed here only for what is taken from it: the app's TypeScript project,
// which also reads this file, knows no Node types.
declare const require: (id: 'node:crypto') => { webcrypto: Crypto };

// jsdom's crypto has getRandomValues and randomUUID but no `subtle`, which every browser Bellkeep
// supports has: lend it Node's Web Crypto, the same standard API.
if (globalThis.crypto.subtle === undefined) Object.defineProperty(globalThis.crypto, 'subtle', { value: require('node:crypto').webcrypto.subtle });
