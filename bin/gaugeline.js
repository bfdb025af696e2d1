#!/usr/bin/env node
// Shim: lets `npx gaugeline` run the TypeScript CLI directly through tsx.
import { register } from 'tsx/esm/api';
import { fileURLToPath } from 'node:url';

// The repo's tsconfig (its @shared path alias) wherever the command is run from; worker
// threads read the same variable.
process.env.TSX_TSCONFIG_PATH ??= fileURLToPath(new URL('../tsconfig.json', import.meta.url));
register();
await import(new URL('../server/cli/main.ts', import.meta.url).href);
